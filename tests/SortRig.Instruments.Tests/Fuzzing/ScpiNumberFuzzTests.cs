using SortRig.Instruments.Scpi;
using Xunit.Abstractions;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// ScpiNumber.Parse on arbitrary, damaged and valid text: it returns the number the NRf grammar
/// and .NET's parser give (see <see cref="NrfOracle"/>), or throws FormatException quoting the text.
/// </summary>
public sealed class ScpiNumberFuzzTests(ITestOutputHelper output)
{
    [Fact]
    public void Parse_ArbitraryText_AgreesWithNrfGrammarOrThrowsFormatException()
    {
        var tally = new Tally();
        var n = FuzzRun.Check(TextMutations.Arbitrary(ScpiNumberGenerators.Syntax), text =>
            ParseAndCompare(text, tally)
        );
        output.WriteLine($"arbitrary text: {n} inputs, {tally}");
        Assert.True(tally.Accepted > 0 && tally.Refused > 0, $"generator reaches one side only: {tally}");
    }

    [Fact]
    public void Parse_NearValidNumber_AgreesWithNrfGrammarOrThrowsFormatException()
    {
        var tally = new Tally();
        var n = FuzzRun.Check(ScpiNumberGenerators.NearValid, m => ParseAndCompare(m.Text, tally));
        output.WriteLine($"near-valid numbers: {n} inputs, {tally}");
        Assert.True(tally.Accepted > n / 20 && tally.Refused > n / 4, $"generator reaches one side only: {tally}");
    }

    [Fact]
    public void Parse_ValidNumber_RoundTripsWithinOneUlp()
    {
        long worst = 0;
        var n = FuzzRun.Check(ScpiNumberGenerators.Valid, v =>
        {
            var parsed = ScpiNumber.Parse(v.Text);
            Assert.Equal(NrfOracle.Expected(v.Text), parsed);
            if (v.RoundTrip)
            {
                // .NET "R", "G17" and "E16" text keeps every bit (IEEE 754 round trip); allow 1 ulp as the brief does.
                var ulps = NrfOracle.Ulps(v.Value, parsed.Value);
                worst = Math.Max(worst, ulps);
                Assert.True(ulps <= 1, $"{v}: parsed {parsed.Value:R}, {ulps} ulp away");
            }
        });
        output.WriteLine($"valid numbers: {n} inputs, worst round-trip error {worst} ulp");
    }

    private static void ParseAndCompare(string text, Tally tally)
    {
        var expected = NrfOracle.Expected(text);
        ScpiNumber parsed;
        try
        {
            parsed = ScpiNumber.Parse(text);
        }
        catch (FormatException ex)
        {
            Assert.True(expected is null, $"refused '{TextEdit.Escaped(text)}', grammar gives {expected}");
            Assert.Contains($"'{text}'", ex.Message, StringComparison.Ordinal);
            Assert.False(ScpiNumber.TryParse(text, out _));
            tally.Refused++;
            return;
        }

        Assert.True(
            expected is not null,
            $"accepted '{TextEdit.Escaped(text)}' as {parsed}, which the grammar refuses"
        );
        Assert.Equal(
            BitConverter.DoubleToInt64Bits(expected.Value.Value),
            BitConverter.DoubleToInt64Bits(parsed.Value)
        );
        Assert.Equal(expected.Value.Format, parsed.Format);
        tally.Accepted++;
    }
}
