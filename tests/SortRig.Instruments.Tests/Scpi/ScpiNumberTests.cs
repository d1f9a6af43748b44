using System.Globalization;
using FsCheck;
using FsCheck.Fluent;
using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Tests.Scpi;

public sealed class ScpiNumberTests
{
    [Theory]
    // IEEE 488.2 sec. 8.7.2 NR1 (integer) and sec. 7.7.2.1 decimal numeric program data, examples from memory
    [InlineData("123", 123.0, ScpiNumberFormat.NR1)]
    [InlineData("+123", 123.0, ScpiNumberFormat.NR1)]
    [InlineData("-123", -123.0, ScpiNumberFormat.NR1)]
    // IEEE 488.2 sec. 8.7.3 NR2 (explicit decimal point); sec. 7.7.2.2 allows digits on one side only
    [InlineData("12.3", 12.3, ScpiNumberFormat.NR2)]
    [InlineData("-.5", -0.5, ScpiNumberFormat.NR2)]
    [InlineData("+1.", 1.0, ScpiNumberFormat.NR2)]
    // IEEE 488.2 sec. 8.7.4 NR3 (with exponent)
    [InlineData("1.23E+4", 12300.0, ScpiNumberFormat.NR3)]
    [InlineData("-12.34567E-3", -0.01234567, ScpiNumberFormat.NR3)]
    [InlineData("1e5", 100000.0, ScpiNumberFormat.NR3)]
    [InlineData("+1.00012340E+04", 10001.234, ScpiNumberFormat.NR3)]
    // IEEE 488.2 sec. 7.7.2.2: white space may stand before and after the exponent letter (from memory)
    [InlineData("1.5 E 3", 1500.0, ScpiNumberFormat.NR3)]
    [InlineData("  42\t", 42.0, ScpiNumberFormat.NR1)]
    public void Parse_Ieee4882Forms(string text, double value, ScpiNumberFormat format)
    {
        var n = ScpiNumber.Parse(text);
        Assert.Equal(format, n.Format);
        Assert.Equal(value, n.Value, 12);
    }

    [Theory]
    // Not NRf per IEEE 488.2 sec. 7.7.2.2: no mantissa digits, two points, empty exponent, hex, comma, mnemonics
    [InlineData("")]
    [InlineData(".")]
    [InlineData("E5")]
    [InlineData("1.2.3")]
    [InlineData("1E")]
    [InlineData("1E+")]
    [InlineData("--1")]
    [InlineData("0x10")]
    [InlineData("1,5")]
    [InlineData("12 34")]
    [InlineData("NaN")]
    [InlineData("INF")]
    [InlineData("1E999")]
    public void TryParse_NotANumber_ReturnsFalse(string text) => Assert.False(ScpiNumber.TryParse(text, out _));

    [Theory]
    // SCPI-99 vol. 1 sec. 7.2.1: +9.9E37 is +infinity / overflow, -9.9E37 -infinity, 9.91E37 NaN
    [InlineData("9.9E37", true, false, false)]
    [InlineData("+9.90000000E+37", true, false, false)]
    [InlineData("-9.9E37", false, true, false)]
    [InlineData("9.91E37", false, false, true)]
    [InlineData("9.8E37", false, false, false)]
    public void SpecialValues_RecognisedPerScpi99(string text, bool overflow, bool negative, bool nan)
    {
        var n = ScpiNumber.Parse(text);
        Assert.Equal((overflow, negative, nan), (n.IsOverflow, n.IsNegativeOverflow, n.IsNotANumber));
        Assert.Equal(!overflow && !negative && !nan, n.IsOrdinary);
    }

    [Fact]
    public void Parse_AnyFiniteDoubleInNr3_AgreesWithDotNetParser()
    {
        // Reference: .NET's invariant double parser (general-purpose library), on NR3 text as meters send it.
        Prop.ForAll(ArbMap.Default.ArbFor<NormalFloat>(), f =>
            {
                var text = f.Get.ToString("+0.00000000E+00;-0.00000000E+00", CultureInfo.InvariantCulture);
                var n = ScpiNumber.Parse(text);
                return n.Format == ScpiNumberFormat.NR3 && n.Value == double.Parse(text, CultureInfo.InvariantCulture);
            })
            .QuickCheckThrowOnFailure();
    }
}
