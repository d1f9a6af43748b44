using SortRig.Measurement.Readings;

namespace SortRig.Measurement.Tests.Readings;

public sealed class OhmsTextTests
{
    [Theory]
    // Engineering prefixes: 1 kOhm = 1e3 Ohm, 1 MOhm = 1e6 Ohm (SI prefixes, BIPM SI Brochure table 7).
    [InlineData(10_003.21, "10.00321 kOhm")]
    [InlineData(999.5, "999.5000 Ohm")]
    [InlineData(1_234_567, "1.234567 MOhm")]
    public void Format_UsesEngineeringPrefix(double ohms, string expected) =>
        Assert.Equal(expected, OhmsText.Format(ohms));

    [Fact]
    public void Format_Overload_SaysOpen() => Assert.Equal("OPEN", OhmsText.Format(double.PositiveInfinity));

    [Theory]
    // 1 % = 10 000 ppm (definition of ppm, common practice, no source).
    [InlineData(321.4, "+321 ppm")]
    [InlineData(-12, "-12 ppm")]
    [InlineData(25_000, "+2.50 %")]
    public void Ppm_SwitchesToPercentAboveOnePercent(double ppm, string expected) =>
        Assert.Equal(expected, OhmsText.Ppm(ppm));

    [Theory]
    // Same SI prefixes (BIPM SI Brochure table 7); four digits, trailing zeros dropped.
    [InlineData(10_000, "10 kOhm")]
    [InlineData(4_990, "4.990 kOhm")] // four digits: only whole trailing-zero decimals go
    [InlineData(100, "100 Ohm")]
    [InlineData(2_000_000, "2 MOhm")]
    public void Nominal_DropsTrailingZeros(double ohms, string expected) =>
        Assert.Equal(expected, OhmsText.Nominal(ohms));

    [Theory]
    [InlineData(4_990, "4.99k Ω", "4k99")]
    [InlineData(10_000, "10k Ω", "10k")]
    [InlineData(1_000_000, "1M Ω", "1M")]
    [InlineData(470, "470 Ω", "470R")]
    public void CompactAndFileToken_UseThePrefixAsTheDecimalMarkInFileNames(double ohms, string compact, string token)
    {
        Assert.Equal(compact, OhmsText.Compact(ohms));
        Assert.Equal(token, OhmsText.FileToken(ohms));
    }
}
