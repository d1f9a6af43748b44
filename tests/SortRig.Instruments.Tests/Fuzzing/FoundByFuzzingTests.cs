using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Tests.Support;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// Inputs on which the fuzz properties failed, kept as plain facts; each failed before its fix in
/// src/SortRig.Instruments (see docs/reliability-fuzzing.md).
/// </summary>
public sealed class FoundByFuzzingTests
{
    [Fact]
    public void Resource_OptionsOnNonSerialResource_ReportedAsTheOption()
    {
        // Was reported as "part 1", which is the interface keyword "sIm", not the text after '?'.
        var ex = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse("sIm?::NG.ocGGzU:inStr"));
        Assert.Equal((true, 1, "::NG.ocGGzU:inStr", 4), (ex.IsOption, ex.PartNumber, ex.PartText, ex.Offset));
        Assert.StartsWith(
            "sIm?::NG.ocGGzU:inStr: option 1 '::NG.ocGGzU:inStr' is not allowed",
            ex.Message,
            StringComparison.Ordinal
        );
    }

    [Fact]
    public void Resource_MissingPartBeforeOptions_ReportedWhereTheAddressEnds()
    {
        // Was reported at offset 30, the end of the serial options, not at the '?' where the device path is missing.
        const string Text = "asRl?parity=even&data=8&STOP=2";
        var ex = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse(Text));
        Assert.Equal((false, 2, string.Empty), (ex.IsOption, ex.PartNumber, ex.PartText));
        Assert.Equal(Text.IndexOf('?', StringComparison.Ordinal), ex.Offset);
    }

    [Theory]
    // The fuzzer found "usb" (empty field name in the message); the other two were off by one field the same way.
    [InlineData("\tusb ", 2, "vendor id")]
    [InlineData("USB::0x1234::INSTR", 3, "product id")]
    [InlineData("USB::0x1234::0x5678", 4, "serial number")]
    public void Resource_UsbMissingField_NamesThatField(string text, int part, string field)
    {
        var ex = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse(text));
        Assert.Equal((part, field), (ex.PartNumber, ex.Expected));
        Assert.Contains($"is where the {field} should be", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    // Found as simulator.yaml with a value replaced by text holding "*|x" (replay seed
    // 867916123302236427,2680645280397737513); reduced by hand to two aliases in a row, on which YamlDotNet 18.1 throws
    // ArgumentException, not YamlException.
    [InlineData("a: *x *y", 2)]
    [InlineData("family: simulator\nover_range: *x *y\n", 3)]
    public void Profile_TwoAliasesInARow_IsAYamlError(string yaml, int line)
    {
        var ex = Assert.Throws<ProfileException>(() => MeterProfileLoader.Parse(yaml, "aliases.yaml"));
        Assert.Equal(("aliases.yaml", line, string.Empty), (ex.File, ex.Line, ex.Field));
        Assert.StartsWith($"aliases.yaml:{line}:1: (document): YAML error", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Profile_ShippedSimulatorWithTwoAliasesInAValue_IsAYamlError()
    {
        var path = Path.Combine(RepoPaths.Instruments, "simulator.yaml");
        var text = File.ReadAllText(path).Replace("over_range: 1.25", "over_range: *x *y", StringComparison.Ordinal);
        var ex = Assert.Throws<ProfileException>(() => MeterProfileLoader.Parse(text, path));
        Assert.Contains("YAML error", ex.Problem, StringComparison.Ordinal);
        Assert.InRange(ex.Line, 1, text.Split('\n').Length);
    }
}
