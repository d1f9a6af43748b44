using SortRig.Measurement.Ranging;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Ranging;

/// <summary>Multi-nominal plans: an R-2R ladder's 10 k / 20 k pair sits on two ranges of the invented meter.</summary>
public sealed class RangePlanTests
{
    [Fact]
    public void Plan_SameRange_HasNoTransfers()
    {
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(4_990, 0.01, 0.001, 1, true), new RangeRequest(10_000, 0.01, 0.001, 1, true)]
        );
        Assert.False(plan.SpansRanges);
        Assert.True(plan.AllResolvable);
    }

    [Fact]
    public void Plan_TenAndTwentyKilohm_OffersTransferWithSpecGainUncertainty()
    {
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(10_000, 0.01, 0.001, 1, true), new RangeRequest(20_000, 0.01, 0.001, 1, true)]
        );

        var t = Assert.Single(plan.Transfers);
        Assert.Equal(10_000, t.LowRange.FullScale);
        Assert.Equal(100_000, t.HighRange.FullScale);
        // 1 y gain terms 0.0085 % (10 k) and 0.0095 % (100 k), rectangular, combined:
        // √((8.5e-5² + 9.5e-5²)/3) = √(1.625e-8/3) = 7.360e-5.
        Assert.Equal(Math.Sqrt(1.625e-8 / 3), t.GainUncertainty, 15);
        Assert.Equal(10_000, t.BridgeNominal);
        // 2 × 7.360e-5 = 1.47e-4 <= 0.25 × 0.1 % = 2.5e-4: fine uncorrected.
        Assert.True(t.UncorrectedResolvable);
        // Bridge 10 k on 100 k range at 1 NPLC: 0.05/√3, 0.07/√8, 0.1 × (0.3 + 0.4)/√3 → 0.0555 Ohm; on 10 k: 0.005/√3,
        // 0.007/√8, 0.1 × (0.25 + 0.04)/√3 → 0.01717 Ohm.
        var uHigh = Math.Sqrt(Sq(0.05 / Math.Sqrt(3)) + Sq(0.07 / Math.Sqrt(8)) + Sq(0.07 / Math.Sqrt(3))) / 10_000;
        var uLow = Math.Sqrt(Sq(0.005 / Math.Sqrt(3)) + Sq(0.007 / Math.Sqrt(8)) + Sq(0.029 / Math.Sqrt(3))) / 10_000;
        Assert.Equal(Math.Sqrt(Sq(uHigh) + Sq(uLow)), t.ExpectedCorrectionUncertainty, 15);
    }

    [Fact]
    public void Plan_TightMatchAcrossRanges_NeedsTheCorrection()
    {
        // 0.01 % match: allowed 2.5e-5 relative; uncorrected 1.47e-4 fails, corrected 2 × 5.81e-6 = 1.16e-5 passes.
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(10_000, 0.01, 0.0001, 1, true), new RangeRequest(20_000, 0.01, 0.0001, 1, true)]
        );
        var t = Assert.Single(plan.Transfers);
        Assert.False(t.UncorrectedResolvable);
        Assert.True(t.CorrectedResolvable);
    }

    [Fact]
    public void Correction_BridgingPart_GivesFactorAndUncertainty()
    {
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(10_000, 0.01, 0.0001, 1, true), new RangeRequest(20_000, 0.01, 0.0001, 1, true)]
        );
        var t = plan.Transfers[0];
        var c = t.Correction(new MeasuredValue(10_000.50, 0.7, 0.015), new MeasuredValue(10_000.80, 0.7, 0.054));

        // F = 10000.50 / 10000.80 = 1 − 0.30/10000.80 = 0.99997000 (hand arithmetic).
        Assert.Equal(0.9999700024, c.Factor, 9);
        // u_rel = √((0.015/10000.5)² + (0.054/10000.8)²) = 5.604e-6.
        Assert.Equal(5.604e-6, c.RelativeStandardUncertainty, 9);
        var corrected = c.Apply(new MeasuredValue(20_001.00, 1.2, 0.06));
        Assert.Equal(20_001.00 * 0.9999700024, corrected.Value, 5);
        Assert.True(corrected.TransferUncertainty > 0.06);
    }

    [Fact]
    public void Inverted_PutsLowRangeValuesOnTheHighRangesScale_SameRelativeUncertainty()
    {
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(10_000, 0.01, 0.0001, 1, true), new RangeRequest(20_000, 0.01, 0.0001, 1, true)]
        );
        var c = plan.Transfers[0]
            .Correction(new MeasuredValue(10_000.50, 0.7, 0.015), new MeasuredValue(10_000.80, 0.7, 0.054));

        var inverse = c.Inverted();

        // F' = 10000.80 / 10000.50 = 1 + 0.30/10000.50 = 1.0000299985 (hand arithmetic); u_rel unchanged
        // (JCGM 100:2008 sec. 5.1.6: relative uncertainties of X^p scale by |p|, here p = -1).
        Assert.Equal(1.0000299985, inverse.Factor, 9);
        Assert.Equal(c.RelativeStandardUncertainty, inverse.RelativeStandardUncertainty);
        Assert.Equal(
            (c.FromRangeFullScale, c.ToRangeFullScale),
            (inverse.ToRangeFullScale, inverse.FromRangeFullScale)
        );
        // The bridging part's low-range reading lands on its high-range reading.
        Assert.Equal(10_000.80, inverse.Apply(new MeasuredValue(10_000.50, 0.7, 0.015)).Value, 6);
    }

    [Fact]
    public void Correction_DifferentParts_Throws()
    {
        var plan = RangeRule.Plan(
            InventedMeter.Spec(),
            [new RangeRequest(10_000, 0.01, 0.001, 1, true), new RangeRequest(20_000, 0.01, 0.001, 1, true)]
        );
        Assert.Throws<ArgumentException>(() =>
            plan.Transfers[0].Correction(new MeasuredValue(10_000, 1, 0.1), new MeasuredValue(20_000, 1, 0.1))
        );
    }

    private static double Sq(double x) => x * x;
}
