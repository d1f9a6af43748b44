using SortRig.Measurement.Control;

namespace SortRig.Measurement.Tests.Control;

/// <summary>
/// The rules that judge a point: rule 1 (one point beyond 3 sigma), rule 2 (two of three beyond 2 sigma on one side)
/// and rule 4 (eight in a row on one side) as the Western Electric Statistical Quality Control Handbook (1956) states
/// them, and the moving-range limit D4 · MR-bar (NIST/SEMATECH e-Handbook sec. 6.3.2.2); both from memory.
/// </summary>
public sealed class ControlChartTests
{
    // Limits of the hand-worked series in ChartLimitsTests: centre 10.1, sigma 0.33244681,
    // UCL 11.09734043, LCL 9.10265957, MR UCL 1.225125.
    private static readonly ChartLimits s_limits = ChartLimits.FromHistory([10.0, 10.4, 9.8, 10.2, 10.1]);

    [Fact]
    public void Judge_PointInsideLimits_InControl()
    {
        ControlVerdict verdict = ControlChart.Judge(s_limits, [10.3]);

        Assert.True(verdict.InControl);
        Assert.Equal(ControlRule.None, verdict.Rule);
        Assert.Equal(string.Empty, verdict.Reason);
        Assert.Equal((10.3 - 10.1) / 0.33244681, verdict.SigmaScore, 6);
    }

    [Theory]
    [InlineData(11.10)] // just above UCL 11.0973
    [InlineData(9.10)] // just below LCL 9.1027
    public void Judge_PointBeyondThreeSigma_Rule1(double x)
    {
        ControlVerdict verdict = ControlChart.Judge(s_limits, [x]);

        Assert.False(verdict.InControl);
        Assert.Equal(ControlRule.BeyondThreeSigma, verdict.Rule);
        Assert.Contains("3-sigma", verdict.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Judge_JumpAboveMovingRangeLimit_FlagsMovingRange()
    {
        // 9.5 -> 10.8: both inside 9.103..11.097, but the range 1.3 exceeds 1.225125
        ControlVerdict verdict = ControlChart.Judge(s_limits, [9.5, 10.8]);

        Assert.Equal(ControlRule.MovingRangeAboveLimit, verdict.Rule);
    }

    [Fact]
    public void Judge_TwoOfThreeBeyondTwoSigma_Rule2()
    {
        // 2 sigma above centre = 10.1 + 0.66489 = 10.76489; 10.8 and 10.9 both beyond, same side
        ControlVerdict verdict = ControlChart.Judge(s_limits, [10.8, 10.3, 10.9]);

        Assert.Equal(ControlRule.TwoOfThreeBeyondTwoSigma, verdict.Rule);
    }

    [Fact]
    public void Judge_EightOnOneSide_Rule4()
    {
        double[] points = [10.2, 10.3, 10.15, 10.2, 10.25, 10.2, 10.3, 10.2];

        Assert.True(ControlChart.Judge(s_limits, points[..7]).Rule is not ControlRule.EightOnOneSide);
        Assert.Equal(ControlRule.EightOnOneSide, ControlChart.Judge(s_limits, points).Rule);
    }

    [Fact]
    public void Judge_SlowDriftInsideShewhartLimits_EwmaFires()
    {
        // Alternating sides (rule 4 silent), each inside 2 sigma (rules 1, 2 silent), moving ranges < 1.2251,
        // but the mean sits +0.5 sigma high: the EWMA (lambda 0.2, L 2) leaves its limits.
        var options = new EwmaOptions { Lambda = 0.2, Width = 2 };
        var points = new List<double>();
        ControlVerdict? fired = null;
        for (int i = 0; i < 60 && fired is null; i++)
        {
            points.Add(i % 2 == 0 ? 10.6 : 10.05);
            ControlVerdict verdict = ControlChart.Judge(s_limits, points, options);
            fired = verdict.InControl ? null : verdict;
        }

        Assert.NotNull(fired);
        Assert.Equal(ControlRule.EwmaBeyondLimits, fired.Rule);
    }
}
