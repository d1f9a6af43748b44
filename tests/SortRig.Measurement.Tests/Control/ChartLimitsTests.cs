using SortRig.Measurement.Control;

namespace SortRig.Measurement.Tests.Control;

public sealed class ChartLimitsTests
{
    [Fact]
    public void FromHistory_ShortSeries_MatchesLimitsWorkedByHand()
    {
        // Individuals and moving-range chart (Montgomery ch. 6.4; NIST/SEMATECH e-Handbook sec. 6.3.2.2):
        // x = 10.0, 10.4, 9.8, 10.2, 10.1
        // mean   = (10.0 + 10.4 + 9.8 + 10.2 + 10.1) / 5 = 50.5 / 5 = 10.1
        // MR     = |10.4-10.0|, |9.8-10.4|, |10.2-9.8|, |10.1-10.2| = 0.4, 0.6, 0.4, 0.1
        // MR-bar = 1.5 / 4 = 0.375
        // sigma  = MR-bar / d2 = 0.375 / 1.128 = 0.33244681
        // UCL    = 10.1 + 3 * 0.33244681 = 10.1 + 0.99734043 = 11.09734043
        // LCL    = 10.1 - 0.99734043 = 9.10265957
        // MR UCL = D4 * MR-bar = 3.267 * 0.375 = 1.225125; MR LCL = D3 * MR-bar = 0
        ChartLimits limits = ChartLimits.FromHistory([10.0, 10.4, 9.8, 10.2, 10.1]);

        Assert.Equal(10.1, limits.Centre, 12);
        Assert.Equal(0.375, limits.MovingRangeMean, 12);
        Assert.Equal(0.33244681, limits.Sigma, 8);
        Assert.Equal(11.09734043, limits.Upper, 8);
        Assert.Equal(9.10265957, limits.Lower, 8);
        Assert.Equal(1.225125, limits.MovingRangeUpper, 12);
        Assert.Equal(0, limits.MovingRangeLower);
        Assert.Equal(5, limits.HistoryCount);
    }

    [Fact]
    public void FromHistory_RepeatingValues_UsesSigmaFloorForBothCharts()
    {
        // A simulated meter may repeat exactly: MR-bar = 0 would give zero-width limits.
        ChartLimits limits = ChartLimits.FromHistory([5.0, 5.0, 5.0], sigmaFloor: 0.01);

        Assert.Equal(0.01, limits.Sigma, 12);
        Assert.Equal(5.03, limits.Upper, 12);
        Assert.Equal(4.97, limits.Lower, 12);

        // The moving-range limit follows the floored sigma: D4 * d2 * sigma = 3.267 * 1.128 * 0.01 = 0.03685176.
        // (Found by the check crash test: a 2 ppm step failed the MR test against an unfloored MR-bar.)
        Assert.Equal(0.03685176, limits.MovingRangeUpper, 10);
    }

    [Fact]
    public void FromHistory_OneValue_Throws() => Assert.Throws<ArgumentException>(() => ChartLimits.FromHistory([1.0]));

    [Fact]
    public void Provisional_ThreeSigmaAroundCentre()
    {
        ChartLimits limits = ChartLimits.Provisional(100, 0.5);

        Assert.Equal(101.5, limits.Upper, 12);
        Assert.Equal(98.5, limits.Lower, 12);
        Assert.True(double.IsPositiveInfinity(limits.MovingRangeUpper));
    }
}
