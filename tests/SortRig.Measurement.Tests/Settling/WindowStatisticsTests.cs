using SortRig.Measurement.Settling;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

public sealed class WindowStatisticsTests
{
    [Fact]
    public void CriticalT_EightReadings_MatchesStudentTable()
    {
        // Two-sided 5 %, ν = 6: t = 2.447 (JCGM 100:2008 Table G.2 gives 2.45 for 95 %, ν = 6; from memory).
        Assert.Equal(2.447, WindowStatistics.CriticalT(8, 0.05), 3);
    }

    [Fact]
    public void Of_ClearLine_SlopeAndSignificanceMatchHandRegression()
    {
        // x = 0..4 s, y = 0 1 1 2 3 (+10 kOhm). Hand: Sxx = 10, Sxy = 7, b = 0.7, SSR = 0.30, s² = 0.1,
        // SE(b) = √(0.1/10) = 0.1, t = 7 > t(3 dof, 2-sided 5 %) = 3.182 (Student t table, from memory; 3.18245
        // by bisection on the t distribution function, textbook identity) → significant.
        var s = WindowStatistics
            .Of(
                [At(0, 10_000), At(1, 10_001), At(2, 10_001), At(3, 10_002), At(4, 10_003)],
                WindowStatistics.CriticalT(5, 0.05)
            )!
            .Value;
        Assert.Equal(0.7, s.Slope, 9);
        Assert.True(s.SlopeSignificant);
        Assert.Equal(10_001.4, s.Mean, 9);
        // Σ(y - 1.4)² = 5.2, s² = 1.3, SEM = √(1.3/5) = 0.5099.
        Assert.Equal(Math.Sqrt(1.3 / 5), s.Sem, 9);
        Assert.Equal(4.0, s.Duration, 9);
    }

    [Fact]
    public void Of_WeakLine_IsNotSignificant()
    {
        // y = 0 1 0 1 1: b = 0.2, SSR = 0.8, SE(b) = √(0.8/3/10) = 0.163, t = 1.22 < 3.182.
        var s = WindowStatistics
            .Of(
                [At(0, 10_000), At(1, 10_001), At(2, 10_000), At(3, 10_001), At(4, 10_001)],
                WindowStatistics.CriticalT(5, 0.05)
            )!
            .Value;
        Assert.Equal(0.2, s.Slope, 9);
        Assert.False(s.SlopeSignificant);
    }

    [Fact]
    public void Of_AllReadingsAtOneInstant_IsNull()
    {
        Assert.Null(WindowStatistics.Of([At(1, 10_000), At(1, 10_001), At(1, 10_002)], 3.0));
    }
}
