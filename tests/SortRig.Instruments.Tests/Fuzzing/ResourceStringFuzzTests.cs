using SortRig.Instruments.Resources;
using Xunit.Abstractions;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// ResourceStringParser.Parse on arbitrary and damaged strings: a resource, or a
/// ResourceStringException whose part number, offset and quoted text point at the offending part.
/// </summary>
public sealed class ResourceStringFuzzTests(ITestOutputHelper output)
{
    [Fact]
    public void Parse_DamagedString_ParsesOrNamesTheOffendingPart()
    {
        var tally = new Tally();
        var n = FuzzRun.Check(ResourceStringMutations.Any, m =>
        {
            try
            {
                var resource = ResourceStringParser.Parse(m.Text);
                Assert.Equal(m.Text.Trim(), resource.Text);
                tally.Accepted++;
            }
            catch (ResourceStringException ex)
            {
                AssertPointsAtOffendingPart(m.Text, ex);
                tally.Refused++;
            }
        });
        output.WriteLine($"damaged resource strings: {n} inputs, {tally}");
        Assert.True(tally.Accepted > n / 20 && tally.Refused > n / 2, tally.ToString());
    }

    [Fact]
    public void Parse_ValidString_RoundTripsToItsFields()
    {
        var n = FuzzRun.Check(ResourceStringGenerators.Valid, v =>
            Assert.Equal(v.Expected, ResourceStringParser.Parse(v.Text))
        );
        output.WriteLine($"valid resource strings: {n} inputs");
    }

    private static void AssertPointsAtOffendingPart(string input, ResourceStringException ex)
    {
        var resource = ex.Resource;
        Assert.Equal(input.Trim(), resource);
        Assert.InRange(ex.Offset, 0, resource.Length);
        Assert.True(
            resource.AsSpan(ex.Offset).StartsWith(ex.PartText, StringComparison.Ordinal),
            $"part text '{TextEdit.Escaped(ex.PartText)}' is not at offset {ex.Offset} of '"
                + $"{TextEdit.Escaped(resource)}'"
        );
        Assert.StartsWith(
            $"{resource}: {(ex.IsOption ? "option" : "part")} {ex.PartNumber} '{ex.PartText}' ",
            ex.Message,
            StringComparison.Ordinal
        );
        Assert.True(ex.PartNumber >= 1, ex.Message);
        Assert.False(string.IsNullOrWhiteSpace(ex.Expected), ex.Message);

        var query = resource.IndexOf('?', StringComparison.Ordinal);
        var bodyEnd = query < 0 ? resource.Length : query;
        if (ex.IsOption)
        {
            // An option starts just after the '?' or after an '&'.
            Assert.True(query >= 0 && ex.Offset > query && resource[ex.Offset - 1] is '?' or '&', ex.Message);
            return;
        }

        // A part lies in the address, before any '?' options; a missing part is reported where the address ends.
        Assert.True(ex.Offset <= bodyEnd, $"offset {ex.Offset} is past the address end {bodyEnd}: {ex.Message}");
        if (ex.Offset < bodyEnd || ex.PartText.Length > 0)
        {
            Assert.Equal(SeparatorsBefore(resource, ex.Offset), ex.PartNumber - 1);
        }
    }

    /// <summary>"::" separators before <paramref name="offset"/>, outside [brackets] (VPP-4.3 IPv6 hosts, from
    /// memory).</summary>
    private static int SeparatorsBefore(string resource, int offset)
    {
        int count = 0,
            depth = 0;
        for (var i = 0; i + 1 < offset; i++)
        {
            depth = resource[i] switch
            {
                '[' => depth + 1,
                ']' => Math.Max(0, depth - 1),
                _ => depth,
            };
            if (depth == 0 && resource[i] == ':' && resource[i + 1] == ':')
            {
                count++;
                i++;
            }
        }

        return count;
    }
}
