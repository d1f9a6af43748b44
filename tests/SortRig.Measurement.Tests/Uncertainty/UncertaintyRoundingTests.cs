using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class UncertaintyRoundingTests
{
    [Theory]
    // JCGM 100:2008 sec. 7.2.2 example: m = 100.021 47 g with u = 0.35 mg is quoted to the same (fifth) decimal.
    [InlineData(100.02147, 0.00035, "100.02147", "0.00035")]
    // Two significant digits of U, value to the same place (JCGM 100:2008 sec. 7.2.6); figures invented.
    [InlineData(9999.87312, 0.02412, "9999.873", "0.024")]
    [InlineData(10_043.795, 1.2805, "10043.8", "1.3")]
    [InlineData(1_000_123.4, 240, "1000123", "240")]
    // 0.0996 rounds to 0.100 at three decimals: one fewer keeps two significant digits.
    [InlineData(20_000.12345, 0.0996, "20000.12", "0.10")]
    public void Round_UToTwoDigitsAndTheValueAlike(double value, double u, string expectedValue, string expectedU)
    {
        Assert.Equal((expectedValue, expectedU), UncertaintyRounding.Round(value, u));
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(double.NaN)]
    public void Round_NoUsableUncertainty_GivesTheValueAsIsAndZero(double u) =>
        Assert.Equal(("1234.5", "0"), UncertaintyRounding.Round(1234.5, u));
}
