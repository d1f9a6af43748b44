using SortRig.Measurement.Ranging;

namespace SortRig.Measurement.Tests.Ranging;

public sealed class HandRangeRuleTests
{
    [Fact]
    public void Choose_TenKilohmOnePercent_SetsFiftyKilohmRange_NoWarnings()
    {
        // Largest part 10 000 × 1.01 × 1.02 = 10 302 Ohm (arithmetic): above 4 999.9 (5 k range), below 49 999 (50 k
        // range).
        var d = HandRangeRule.Choose(TypedMeter.Spec, new HandRangeRequest(10_000, 0.01, 0.001));

        Assert.Equal(50_000, d.Range.FullScale);
        Assert.Empty(d.Warnings);
        Assert.True(d.Usable);
        Assert.Contains("50 kOhm range", d.Instruction, StringComparison.Ordinal);
        Assert.Contains("49.999 kOhm", d.Instruction, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_RangeTooLow_OverflowRefused()
    {
        var d = HandRangeRule.Check(TypedMeter.Spec, new HandRangeRequest(10_000, 0.01, 0.001), TypedMeter.R5k);

        Assert.False(d.Usable);
        var w = Assert.Single(d.Warnings);
        Assert.Equal(HandRangeWarningKind.Overflow, w.Kind);
        Assert.Contains("4.9999 kOhm", w.Text, StringComparison.Ordinal);
        Assert.Contains("set the 50 kOhm range", w.Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_RangeTooHigh_LosesADigit_AndIsTooCoarse()
    {
        // 500 k range: one digit = 10 Ohm against 1 Ohm on the 50 k range: one digit lost (log10 10 = 1).
        // k·u of a digit = 10/√3 = 5.77 Ohm > 0.25 × 0.001 × 10 000 = 2.5 Ohm (4:1 ratio, common practice, no source).
        var d = HandRangeRule.Check(TypedMeter.Spec, new HandRangeRequest(10_000, 0.01, 0.001), TypedMeter.R500k);

        Assert.True(d.Usable);
        Assert.Equal([HandRangeWarningKind.LostDigit, HandRangeWarningKind.Coarse], d.Warnings.Select(w => w.Kind));
        Assert.Contains("1 digit less", d.Warnings[0].Text, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_MatchTighterThanOneDigit_WarnsCoarse_WithTheMatchItResolves()
    {
        // ±0.01 % of 10 kOhm = ±1 Ohm; allowed k·u = 0.25 Ohm; a digit gives 1/√3 = 0.577 Ohm.
        // Smallest match resolved: 0.577/(0.25 × 10 000) = 2.309e-4, rounded up to two digits: 2.4e-4 = ±240 ppm.
        var d = HandRangeRule.Choose(TypedMeter.Spec, new HandRangeRequest(10_000, 0.01, 0.0001));

        var w = Assert.Single(d.Warnings);
        Assert.Equal(HandRangeWarningKind.Coarse, w.Kind);
        Assert.Contains("±240 ppm", w.Text, StringComparison.Ordinal);
        Assert.True(d.Usable);
    }

    [Theory]
    [InlineData(100, 500)] // 100 × 1.0302 = 103 Ohm: the 500 Ohm range shows 499.99
    [InlineData(4_700, 5_000)] // 4 842 Ohm < 4 999.9
    [InlineData(4_990, 50_000)] // 5 084 Ohm > 4 999.9: the next range up
    [InlineData(1e6, 5e6)]
    public void Recommend_LowestRangeThatShowsTheLargestPart(double nominal, double fullScale) =>
        Assert.Equal(
            fullScale,
            HandRangeRule.Recommend(TypedMeter.Spec, new HandRangeRequest(nominal, 0.01, 0.001)).FullScale
        );

    [Fact]
    public void Recommend_AboveEveryRange_Throws() =>
        Assert.Throws<ArgumentException>(() =>
            HandRangeRule.Recommend(TypedMeter.Spec, new HandRangeRequest(100e6, 0.01, 0.001))
        );
}
