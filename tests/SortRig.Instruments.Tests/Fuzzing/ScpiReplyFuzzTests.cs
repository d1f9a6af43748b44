using System.Text.RegularExpressions;
using SortRig.Instruments.Scpi;
using Xunit.Abstractions;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// ScpiError.Parse (SYST:ERR?) and InstrumentIdentity.Parse (*IDN?) on arbitrary, damaged and valid
/// replies: a value consistent with the reply, or ScpiResponseException quoting reply and command.
/// </summary>
public sealed partial class ScpiReplyFuzzTests(ITestOutputHelper output)
{
    private const string Command = "SYST:ERR?";

    [Fact]
    public void ErrorParse_AnyReply_GivesTheCodeOrThrowsResponseException()
    {
        var tally = new Tally();
        var n = FuzzRun.Check(ScpiReplyGenerators.AnyError, reply =>
        {
            var comma = reply.IndexOf(',', StringComparison.Ordinal);
            var codeText = comma < 0 ? reply : reply[..comma];
            int? code = NrfOracle.Expected(codeText)
                is { Format: ScpiNumberFormat.NR1, Value: >= int.MinValue and <= int.MaxValue } c
                ? (int)c.Value
                : null;
            try
            {
                var error = ScpiError.Parse(reply, Command);
                Assert.Equal(code, error.Code);
                var rest = comma < 0 ? string.Empty : reply[(comma + 1)..].Trim();
                if (ScpiString().IsMatch(rest))
                {
                    Assert.Equal(rest[1..^1].Replace("\"\"", "\"", StringComparison.Ordinal), error.Message);
                }

                tally.Accepted++;
            }
            catch (ScpiResponseException ex)
            {
                Assert.True(code is null, $"refused '{TextEdit.Escaped(reply)}' with integer code {code}");
                AssertNamesReply(ex, reply, Command);
                tally.Refused++;
            }
        });
        output.WriteLine($"SYST:ERR? replies: {n} inputs, {tally}");
        Assert.True(tally.Accepted > n / 10 && tally.Refused > n / 10, tally.ToString());
    }

    [Fact]
    public void ErrorParse_ValidReply_RoundTrips()
    {
        var n = FuzzRun.Check(ScpiReplyGenerators.ValidError, e =>
            Assert.Equal(new ScpiError(e.Code, e.Message), ScpiError.Parse(e.Text, Command))
        );
        output.WriteLine($"valid SYST:ERR? replies: {n} inputs");
    }

    [Fact]
    public void IdentityParse_AnyReply_GivesFourFieldsOrThrowsResponseException()
    {
        var tally = new Tally();
        var n = FuzzRun.Check(ScpiReplyGenerators.AnyIdentity, reply =>
        {
            var commas = reply.Count(c => c == ',');
            try
            {
                var id = InstrumentIdentity.Parse(reply);
                Assert.True(commas >= 3 && id.Model.Length > 0, $"accepted '{TextEdit.Escaped(reply)}' as {id}");
                Assert.Equal(reply[..reply.IndexOf(',', StringComparison.Ordinal)].Trim(), id.Manufacturer);
                Assert.False(
                    string.Concat(id.Manufacturer, id.Model, id.Serial).Contains(',', StringComparison.Ordinal)
                );
                tally.Accepted++;
            }
            catch (ScpiResponseException ex)
            {
                AssertNamesReply(ex, reply, "*IDN?");
                tally.Refused++;
            }
        });
        output.WriteLine($"*IDN? replies: {n} inputs, {tally}");
        Assert.True(tally.Accepted > n / 10 && tally.Refused > n / 10, tally.ToString());
    }

    [Fact]
    public void IdentityParse_ValidReply_RoundTrips()
    {
        var n = FuzzRun.Check(ScpiReplyGenerators.ValidIdentity, r =>
            Assert.Equal(
                new InstrumentIdentity(r.Manufacturer, r.Model, r.Serial, r.Firmware),
                InstrumentIdentity.Parse(r.Text)
            )
        );
        output.WriteLine($"valid *IDN? replies: {n} inputs");
    }

    private static void AssertNamesReply(ScpiResponseException ex, string reply, string command)
    {
        Assert.Equal((reply, command), (ex.Reply, ex.Command));
        Assert.Contains($"'{reply}'", ex.Message, StringComparison.Ordinal);
        Assert.Contains($"'{command}'", ex.Message, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(ex.Expected));
    }

    // IEEE 488.2 sec. 8.7.8 string response data: "..." with each inner quote doubled (from memory).
    [GeneratedRegex("\\A\"(?:[^\"]|\"\")*\"\\z", RegexOptions.CultureInvariant)]
    private static partial Regex ScpiString();
}
