using SortRig.Planning.Cups;
using static SortRig.Planning.Tests.Cups.CupAssignerContractTests;

namespace SortRig.Planning.Tests.Cups;

/// <summary>The choice, while learning, between opening an empty cup's band now and letting the part wait.</summary>
public sealed class CommitWaitTests
{
    private static readonly Dictionary<double, int> s_quad = new() { [10e3] = 4 };

    [Fact]
    public void IdenticalParts_FixingThePlannedBand_CostsNothing()
    {
        // Referee: a bootstrap resample of a sample whose values are all equal is that sample (Efron's bootstrap draws
        // from the sample itself, from memory), so every resample's best plan is the plan itself, which holds the band:
        // fixing it loses nothing. A wrong lattice index or a band counted twice gives a regret above zero.
        var state = new NominalBands(10e3, new AdaptiveCupOptions(8, 1000, 1.0, s_quad));
        for (var i = 1; i <= 12; i++)
        {
            state.Samples.Add((i, 300, 10));
        }

        state.Replan(_ => true);
        var band = Assert.Single(state.Bands, b => b.Fits(300, 10));

        Assert.InRange(state.CommitRegret(band, _ => true, 8), 0, 1e-9);
    }

    [Fact]
    public void BandAwayFromEveryPart_Regret_IsTheShareTheBestBandWouldAddOverIt()
    {
        // One cup, 12 parts all at +300 ppm (every resample is the sample). Referee: a hand computation from the
        // estimate's published pieces. Weights: 12 parts, 12 × 40 / 52 ≈ 9.2 mirrored at −300, 5 prior pseudo-parts
        // of N(0, 3333). The kernels of identical parts get the smallest bandwidth of the cross-validation grid (cap /
        // 20 ≈ 167 ppm). The best single band is centred: each kernel puts Φ(190 / 167) ≈ 0.87 of its mass inside
        // [−490, +490] and the prior P(|X| < 490) ≈ 0.12, so it takes ≈ (21.2 × 0.87 + 5 × 0.12) / 26.2 ≈ 0.73 of the
        // coming parts; a band on [+3000, +4000] takes only the prior's 5 × (Φ(1.2) − Φ(0.9)) / 26.2 ≈ 0.013. Fixing
        // it therefore costs ≈ 0.71 of the coming parts.
        var options = new AdaptiveCupOptions(1, 1000, 1.0, s_quad);
        var state = new NominalBands(10e3, options);
        for (var i = 1; i <= 12; i++)
        {
            state.Samples.Add((i, 300, 10));
        }

        var far = new NominalBands.Band(0, "A", 3000, 4000);
        var regret = state.CommitRegret(far, _ => true, 8);

        Assert.InRange(regret, 0.66, 0.76);
    }

    [Fact]
    public void NothingLeftToCome_NeverWaits_AndNoPartWaitsAfterLearning()
    {
        // With one part expected (reelParts = 1) there is no later part a wait could save, so no decision may say it
        // waits (definition of the rule: the saving is a share of the parts still to come). After the learn count the
        // rule is off in any case.
        var reel = HoleReel(41, 150);
        var none = new AdaptiveCupPlanner(new AdaptiveCupOptions(8, 1000, 1.0, s_quad, learnCount: 30, reelParts: 1));
        var some = new AdaptiveCupPlanner(new AdaptiveCupOptions(8, 1000, 1.0, s_quad, learnCount: 30));
        var waitsNone = reel.Select((d, i) => none.Assign(Part(i + 1, 10e3, d)).Reason).Count(r => r.Contains("waits"));
        var reasons = reel.Select((d, i) => some.Assign(Part(i + 1, 10e3, d)).Reason).ToList();

        Assert.Equal(0, waitsNone);
        Assert.DoesNotContain(reasons.Skip(30), r => r.Contains("waits", StringComparison.Ordinal));
    }

    [Fact]
    public void Restore_WithPartsThatWaited_ReproducesCountsAndTheNextDecision()
    {
        // The regret's resamples are seeded from the sample itself, so a replay reaches the same decisions. The test
        // first checks that its reel does make parts wait (a hole reel, where early bands are least certain).
        var options = new AdaptiveCupOptions(8, 1000, 1.0, s_quad, learnCount: 40);
        var first = new AdaptiveCupPlanner(options);
        var history = new List<(CupRequest, string)>();
        var waited = 0;
        var reel = HoleReel(43, 200);
        for (var n = 1; n <= reel.Count; n++)
        {
            var req = Part(n, 10e3, reel[n - 1]);
            var d = first.Assign(req);
            waited += d.Reason.Contains("waits", StringComparison.Ordinal) ? 1 : 0;
            history.Add((req, d.CupLabel));
        }

        Assert.True(waited > 0, "no part waited on this reel");
        var second = new AdaptiveCupPlanner(options);
        second.Restore(history);

        Assert.Equal(first.Counts, second.Counts);
        foreach (var dev in new[] { 4321.0, -5555, 8100 })
        {
            var next = Part(1000 + (long)Math.Abs(dev), 10e3, dev);
            Assert.Equal(first.Assign(next), second.Assign(next));
        }
    }

    [Fact]
    public void Options_ReelPartsOutOfRange_Throw()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new AdaptiveCupOptions(8, 1000, 1.0, s_quad, reelParts: 0));
    }

    // MathNet's N(0, 5000) ppm with |x| < 4000 removed: a 1 % lot whose tighter grades were binned out (our own
    // invented reel, as in AdaptiveCupPlannerTests).
    private static List<double> HoleReel(int seed, int n)
    {
        var normal = new MathNet.Numerics.Distributions.Normal(0, 5000, new Random(seed));
        var result = new List<double>();
        while (result.Count < n)
        {
            var x = normal.Sample();
            if (Math.Abs(x) is >= 4000 and <= 10_000)
            {
                result.Add(x);
            }
        }

        return result;
    }
}
