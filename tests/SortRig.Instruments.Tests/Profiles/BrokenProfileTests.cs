using SortRig.Instruments.Profiles;
using SortRig.Instruments.Tests.Support;

namespace SortRig.Instruments.Tests.Profiles;

/// <summary>
/// Each broken profile is the shipped simulator.yaml with one change; the error must name the
/// file, the line of the offending node (found in the changed text, not by the loader) and the field.
/// </summary>
public sealed class BrokenProfileTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-profiles-").FullName;

    public static TheoryData<string, string, string, string, string> Cases =>
        new()
        {
            // name, find, replace with, expected field, text on the expected line
            { "missing key", "family: simulator\n", string.Empty, "family", "identity:" },
            { "unknown key", "over_range: 1.25 ", "colour: blue\nover_range: 1.25 ", "colour", "colour: blue" },
            {
                "negative value",
                "- full_scale: 1000\n",
                "- full_scale: -1000\n",
                "ranges[1].full_scale",
                "full_scale: -1000"
            },
            {
                "unordered ranges",
                "- full_scale: 100000\n",
                "- full_scale: 5000\n",
                "ranges[3].full_scale",
                "full_scale: 5000"
            },
            { "bad type", "over_range: 1.25 ", "over_range: high ", "over_range", "over_range: high" },
            { "quoted number", "nplc: 0.4,", "nplc: \"0.4\",", "nplc[1].nplc", "nplc: \"0.4\"" },
            {
                "unknown nested key",
                "accuracy_24h: { reading_pct: 0.0040, range_pct: 0.0025 }",
                "accuracy_24h: { reading_pct: 0.0040, rang_pct: 0.0025 }",
                "ranges[0].accuracy_24h.rang_pct",
                "rang_pct"
            },
            {
                "24 h looser than 1 year",
                "accuracy_24h: { reading_pct: 0.0040, range_pct: 0.0025 }",
                "accuracy_24h: { reading_pct: 0.0400, range_pct: 0.0025 }",
                "ranges[0].accuracy_1y",
                "accuracy_1y:  { reading_pct: 0.0120, range_pct: 0.0035 }"
            },
            { "unordered nplc", "nplc: 10, ", "nplc: 0.5, ", "nplc[4].nplc", "nplc: 0.5" },
            {
                "unknown placeholder",
                "range: \"SENS:{function}:RANG {range}\"",
                "range: \"SENS:{function}:RANG {rnge}\"",
                "commands.range",
                "{rnge}"
            },
            { "query without ?", "read: \"READ?\"", "read: \"READ\"", "commands.read", "read: \"READ\"" },
            {
                "missing template",
                "  nplc_query: \"SENS:{function}:NPLC?\"\n",
                string.Empty,
                "commands.nplc_query",
                "function_2wire: RES"
            },
            {
                "unknown transport",
                "[simulator, tcp-socket, serial]",
                "[simulator, gpib, serial]",
                "comms.transports[1]",
                "gpib"
            },
            { "bad terminator", "terminator: \"\\n\"", "terminator: \"\\t\"", "comms.terminator", "terminator:" },
            { "bad regex", "model: '^SIM-6H$'", "model: '^SIM-(6H$'", "identity.model", "SIM-(6H" },
            {
                "4-wire mnemonic without 4-wire",
                "four_wire: true",
                "four_wire: false",
                "commands.function_4wire",
                "function_4wire: FRES"
            },
            { "bad serial field", "data_bits: 8", "data_bits: 9", "comms.serial.data_bits", "data_bits: 9" },
            { "fractional baud", "baud: 115200", "baud: 9600.5", "comms.serial.baud", "baud: 9600.5" },
        };

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Theory]
    [MemberData(nameof(Cases))]
    public void BrokenProfile_ErrorNamesFileLineAndField(
        string name,
        string find,
        string replace,
        string field,
        string lineText
    )
    {
        var original = File.ReadAllText(Path.Combine(RepoPaths.Instruments, "simulator.yaml"));
        Assert.Contains(find, original, StringComparison.Ordinal);
        var broken = original.Replace(find, replace, StringComparison.Ordinal);
        var path = Path.Combine(_dir, name.Replace(' ', '-') + ".yaml");
        File.WriteAllText(path, broken);

        var ex = Assert.Throws<ProfileException>(() => MeterProfileLoader.Load(path));

        Assert.Equal(path, ex.File);
        Assert.Equal(field, ex.Field);
        Assert.Equal(LineOf(broken, lineText), ex.Line);
        Assert.True(ex.Column > 0);
        Assert.StartsWith($"{path}:{ex.Line}:{ex.Column}: {field}: ", ex.Message, StringComparison.Ordinal);
        Assert.False(string.IsNullOrWhiteSpace(ex.Expected));
    }

    [Fact]
    public void YamlSyntaxError_ReportsItsLine()
    {
        var original = File.ReadAllText(Path.Combine(RepoPaths.Instruments, "simulator.yaml"));
        var broken = original.Replace(
            "transports: [simulator, tcp-socket, serial]",
            "transports: [simulator, tcp-socket",
            StringComparison.Ordinal
        );
        var path = Path.Combine(_dir, "syntax.yaml");
        File.WriteAllText(path, broken);
        var ex = Assert.Throws<ProfileException>(() => MeterProfileLoader.Load(path));
        Assert.Contains("YAML error", ex.Message, StringComparison.Ordinal);
        Assert.True(ex.Line >= LineOf(broken, "transports:"));
    }

    [Fact]
    public void DuplicateFamily_InLoadAll_NamesBothFiles()
    {
        var text = File.ReadAllText(Path.Combine(RepoPaths.Instruments, "simulator.yaml"));
        File.WriteAllText(Path.Combine(_dir, "a.yaml"), text);
        File.WriteAllText(Path.Combine(_dir, "b.yaml"), text);
        var ex = Assert.Throws<ProfileException>(() => MeterProfileLoader.LoadAll(_dir));
        Assert.Equal((Path.Combine(_dir, "b.yaml"), "family"), (ex.File, ex.Field));
        Assert.Contains("a.yaml", ex.Message, StringComparison.Ordinal);
    }

    private static int LineOf(string text, string marker)
    {
        var lines = text.Split('\n');
        var index = Array.FindIndex(lines, l => l.Contains(marker, StringComparison.Ordinal));
        Assert.True(index >= 0, $"marker '{marker}' not in the profile");
        return index + 1;
    }
}
