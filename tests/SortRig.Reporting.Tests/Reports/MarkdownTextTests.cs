using SortRig.Reporting.Reports;

namespace SortRig.Reporting.Tests.Reports;

public sealed class MarkdownTextTests
{
    // CommonMark 0.31 sec. 2.4: a backslash before ASCII punctuation makes it literal (from memory).
    [Theory]
    [InlineData("bench", "bench")]
    [InlineData("reel #4", "reel \\#4")]
    [InlineData("[click](http://example.invalid)", "\\[click\\](http://example.invalid)")]
    [InlineData("<script>x</script>", "\\<script\\>x\\</script\\>")]
    [InlineData("a\n# forged", "a\\x0A\\# forged")]
    [InlineData("\u001b]0;title\u0007", "\\x1B\\]0;title\\x07")]
    public void Escape_MarkdownAndControlCharacters_ComeOutLiteral(string raw, string expected) =>
        Assert.Equal(expected, MarkdownText.Escape(raw));

    [Fact]
    public void Escape_NeverLeavesALineBreakOrAnUnescapedBracket()
    {
        var raw = string.Concat(Enumerable.Range(0, 128).Select(i => (char)i));
        var escaped = MarkdownText.Escape(raw);
        Assert.DoesNotContain('\n', escaped);
        Assert.DoesNotContain('\r', escaped);
        for (var i = 0; i < escaped.Length; i++)
        {
            if (escaped[i] is '[' or '<' or '#' or '|')
            {
                Assert.Equal('\\', escaped[i - 1]);
            }
        }
    }
}
