using SortRig.Instruments.Profiles;
using Xunit.Abstractions;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// MeterProfileLoader.Parse on damaged copies of the shipped profiles: a profile, or a
/// ProfileException naming the file, a line inside the text, and a field path or the YAML problem.
/// </summary>
public sealed class MeterProfileFuzzTests(ITestOutputHelper output)
{
    [Fact]
    public void Parse_DamagedProfile_LoadsOrNamesFileLineAndField()
    {
        Assert.Equal(4, ProfileMutations.Shipped.Count);
        var tally = new Tally();
        var (syntax, document, field) = (0, 0, 0);
        var n = FuzzRun.Check(ProfileMutations.Any, c =>
        {
            try
            {
                AcceptedProfileRules.AssertHolds(MeterProfileLoader.Parse(c.Text, c.File), c.File);
                tally.Accepted++;
                return;
            }
            catch (ProfileException ex)
            {
                AssertNamesFileLineAndField(c, ex);
                tally.Refused++;
                var kind =
                    ex.Field.Length > 0 ? field++
                    : ex.Problem.StartsWith("YAML error", StringComparison.Ordinal) ? syntax++
                    : document++;
                if (kind < 2)
                {
                    output.WriteLine("  e.g. " + TextEdit.Escaped(ex.Message));
                }
            }
        });
        output.WriteLine(
            $"damaged profiles: {n} inputs, {tally}; refused for: a field {field}, YAML syntax {syntax}, the "
                + $"document {document}"
        );
        Assert.True(
            tally.Accepted > n / 50 && field > n / 4 && syntax > n / 20,
            $"{tally}, field {field}, syntax {syntax}"
        );
    }

    private static void AssertNamesFileLineAndField(ProfileCase c, ProfileException ex)
    {
        var lines = YamlLineCount(c.Text);
        Assert.Equal(c.File, ex.File);
        Assert.True(ex.Line >= 1 && ex.Line <= lines + 1, $"line {ex.Line} outside 1..{lines + 1}: {ex.Message}");
        Assert.True(ex.Column >= 1, $"column {ex.Column}: {ex.Message}");
        Assert.StartsWith($"{c.File}:{ex.Line}:{ex.Column}: ", ex.Message, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(ex.Problem), ex.Message);
        Assert.False(string.IsNullOrWhiteSpace(ex.Expected), ex.Message);
        if (ex.Field.Length > 0)
        {
            Assert.Contains($": {ex.Field}: ", ex.Message, StringComparison.Ordinal);
        }
        else
        {
            // YAML syntax, not one document, root not a mapping, or a blank top-level key.
            Assert.Contains(": (document): ", ex.Message, StringComparison.Ordinal);
        }
    }

    /// <summary>Lines as YAML counts them: CR LF, CR, LF, NEL, LS and PS each end one (YAML 1.1 sec. 4.1.4, from
    /// memory).</summary>
    private static int YamlLineCount(string text)
    {
        var breaks = 0;
        for (var i = 0; i < text.Length; i++)
        {
            if (
                text[i] is '\n' or '\u0085' or '\u2028' or '\u2029'
                || (text[i] == '\r' && (i + 1 == text.Length || text[i + 1] != '\n'))
            )
            {
                breaks++;
            }
        }

        return breaks + 1;
    }
}
