using MathNet.Numerics.Distributions;
using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

public sealed class CoverageEstimateTests
{
    private static double Cdf(double x) => Normal.CDF(0, 300, x);

    private static double Mass(double a, double b) => b > a ? Cdf(b) - Cdf(a) : 0;

    [Fact]
    public void Covered_CountsOverlappingBandsOnce_ByInclusionExclusion()
    {
        // Two bands overlapping by 400 and a third apart; the window [a, b] reaches into all three. Textbook identity
        // (inclusion–exclusion): P(W ∩ (A ∪ B)) = P(W ∩ A) + P(W ∩ B) − P(W ∩ A ∩ B), plus the disjoint third band.
        const double Half = 10;
        (double Lo, double Hi)[] bands = [(-900, 100), (-300, 700), (900, 1900)];
        var (a, b) = (-500.0, 1200.0);
        var fitA = (bands[0].Lo + Half, bands[0].Hi - Half);
        var fitB = (bands[1].Lo + Half, bands[1].Hi - Half);
        var fitC = (bands[2].Lo + Half, bands[2].Hi - Half);
        var expected =
            Mass(Math.Max(a, fitA.Item1), Math.Min(b, fitA.Item2))
            + Mass(Math.Max(a, fitB.Item1), Math.Min(b, fitB.Item2))
            - Mass(Math.Max(a, fitB.Item1), Math.Min(b, fitA.Item2))
            + Mass(Math.Max(a, fitC.Item1), Math.Min(b, fitC.Item2));

        var covered = CoverageEstimate.Covered(Cdf, a, b, Half, bands);

        Assert.Equal(expected, covered, 12);
        Assert.True(covered < Mass(a, b), "the covered share of a window is below its whole share");
    }

    [Fact]
    public void Covered_IsZero_WhenNoBandReachesTheWindow_OrTheBandIsNarrowerThanThePart()
    {
        Assert.Equal(0, CoverageEstimate.Covered(Cdf, -100, 100, 10, [(200, 1200)]));
        // A part of half-width 600 never fits a band of 1000: nothing is covered for it.
        Assert.Equal(0, CoverageEstimate.Covered(Cdf, -100, 100, 600, [(-500, 500)]));
    }

    [Fact]
    public void Gains_LeaveOutWhatHeldBandsTake()
    {
        // One part at 0 (log ppm, half-width 5), band width 1000, grid of 50, kernel σ = 300 (the cap, one part): the
        // window [-500, 500] takes it with probability P(|x| < 495); beside a held band [-500, 500] it adds nothing,
        // and the window [0, 1000] keeps only P(495 < x < 995), the part the held band misses (normal distribution
        // function, MathNet.Numerics as the reference).
        (double, double)[] one = [(0, 5)];
        var free = CoverageEstimate.Gains(one, -1000, 50, 21, 1000, 300);
        var held = CoverageEstimate.Gains(one, -1000, 50, 21, 1000, 300, [(-500, 500)]);
        Assert.Equal(Normal.CDF(0, 300, 495) - Normal.CDF(0, 300, -495), free[10], 12);
        Assert.Equal(0, held[10], 12);
        Assert.Equal(Normal.CDF(0, 300, 995) - Normal.CDF(0, 300, 495), held[20], 12);
        Assert.True(held[20] < free[20]);
    }

    [Fact]
    public void Kernel_ReflectedAtAHole_PutsNoMassInIt_AndFoldsItsTailBack()
    {
        // Reflection method at a boundary (Silverman 1986 sec. 2.10, from memory): a kernel N(c, h) at c ≥ g is
        // mirrored at g, so the mass in [g, g + t] is Φ((g + t − c)/h) − Φ((g − c)/h) plus the same for 2g − c.
        // Referee: MathNet's normal distribution function, by hand here. c = 4100, h = 300, g = 4000.
        const double G = 4000,
            H = 300,
            C = 4100;
        var k = CoverageEstimate.Kernel(C, H, G);
        double Phi(double z) => Normal.CDF(0, 1, z);

        Assert.Equal(0, k(G - 1) - k(-G + 1), 12);
        var expected = Phi((4300 - C) / H) - Phi((G - C) / H) + Phi((4300 - 3900) / H) - Phi((G - 3900) / H);
        Assert.Equal(expected, k(4300) - k(G), 12);
        Assert.Equal(1, k(20_000), 6);
        // Mirrored on the other side: a part at −4100 gives the same mass to [−4300, −4000].
        var m = CoverageEstimate.Kernel(-C, H, G);
        Assert.Equal(expected, m(-G) - m(-4300), 12);
        // Without a hole, or for a part inside it, the plain kernel.
        Assert.Equal(Normal.CDF(C, H, 4300), CoverageEstimate.Kernel(C, H, 0)(4300), 12);
    }
}
