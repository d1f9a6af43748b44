using SortRig.Instruments.Resources;

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
        Assert.StartsWith("sIm?::NG.ocGGzU:inStr: option 1 '::NG.ocGGzU:inStr' is not allowed", ex.Message, StringComparison.Ordinal);
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
}
