using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly.ColumnBound;

/// <summary>
/// The column LP bound: a hand-derived LP value, never below the brute-force optimum, and a certificate whose duals
/// satisfy every dual constraint of the set-packing LP over the feasible sets the independent brute force finds.
/// </summary>
public sealed class ColumnBoundTests
{
    private static readonly AssemblyOptions Defaults = new();

    [Fact]
    public void Triangle_LpValueIsThreeHalves()
    {
        // Three 10k parts within 100 ppm of each other and a two-position recipe matched to 1000 ppm: every two parts
        // form a set. Textbook (fractional matching of a triangle, an odd cycle): the LP optimum is 3/2 (x = 1/2 on
        // each pair, y = 1/2 on each part), so the bound is ⌊3/2⌋ = 1.
        var recipe = RandomInstances.Matched(0);
        var parts = new[] { Part(0, 0), Part(1, 50e-6), Part(2, 100e-6) };
        var r = Run(recipe, parts);
        Assert.Equal(1.5, r.Value, 6);
        Assert.Equal(1, r.Bound);
        Assert.True(r.Converged);
    }

    [Fact]
    public void TwoStars_ColumnLpSeesCrowding_PartCountDoesNot()
    {
        // Two stars of three 10k parts each, 1 % apart: a centre part and two leaves 900 ppm below and above it, match
        // 1000 ppm, two positions. Each leaf fits only with its centre (hand count, common practice, no source), so
        // at most one set per star: optimum 2 and, by LP duality (y = 1 on each centre, Σ y = 2), LP value 2. Every
        // part has a partner, so the part count keeps all six: ⌊6 / 2⌋ = 3.
        var recipe = RandomInstances.Matched(0);
        var parts = new[]
        {
            Part(0, -900e-6),
            Part(1, 0),
            Part(2, 900e-6),
            Part(3, 0.01 - 900e-6),
            Part(4, 0.01),
            Part(5, 0.01 + 900e-6),
        };
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        Assert.Equal(3, PartCountBound.Compute(recipe, usable, new MatchedRule(recipe), Defaults));
        var r = Run(recipe, parts);
        Assert.Equal(2.0, r.Value, 6);
        Assert.Equal(2, r.Bound);
        Assert.Equal(2, BruteForce.Solve(recipe, parts, BruteForce.Matched(recipe)).Count);
        Assert.Equal(2, new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts).UpperBound);
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 40));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void WindowPricing_NeverBelowBruteForceOptimum_AndCertificateIsDualFeasible(int seed) =>
        MatchedCase(seed, enumerate: false);

    [Theory]
    [MemberData(nameof(Seeds))]
    public void EnumeratedPricing_NeverBelowBruteForceOptimum_AndCertificateIsDualFeasible(int seed) =>
        MatchedCase(seed, enumerate: true);

    private static void MatchedCase(int seed, bool enumerate)
    {
        // Every matched shape of the referee tests, pairs included; parts crowded (σ 400 ppm) for a 500 ppm match so
        // that crowding, not counting, limits the sets.
        var rng = new Random(91_000 + seed);
        var shape = seed % RandomInstances.MatchedShapes.Length;
        var recipe = RandomInstances.Matched(shape, ppm: 500);
        double[] nominals = shape switch
        {
            2 or 3 or 4 or 5 => [10e3, 20e3],
            _ => [10e3],
        };
        var parts = RandomInstances.Parts(rng, rng.Next(5, 9), nominals, sigma: 400e-6, maxRelU: 60e-6);
        var judge = BruteForce.Matched(recipe);
        var (optimum, _) = BruteForce.Solve(recipe, parts, judge);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var r = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: enumerate ? 64 : 0);
        Assert.NotNull(r);
        Assert.True(r.Bound >= optimum, $"seed {seed}: column bound {r.Bound} < optimum {optimum}");

        // Certificate (LP duality, textbook): y ≥ 0 and Σ_{i∈S} y_i ≥ m for every feasible set S, here every block of
        // parts the brute force (written apart from the assembler) can arrange into a set; then LP ≤ Σ y / m.
        AssertDualFeasible(recipe, usable, judge, r, seed);

        Assert.Equal((int)Math.Floor((r.Duals.Sum() / r.MinSetCost) + 1e-6), r.Bound);
        var assembled = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts);
        Assert.True(assembled.UpperBound >= optimum, $"seed {seed}: bound {assembled.UpperBound} < {optimum}");
    }

    public static TheoryData<int> DividerSeeds => new(Enumerable.Range(0, 20));

    [Theory]
    [MemberData(nameof(DividerSeeds))]
    public void Divider_ErrorsCancel_NeverBelowBruteForceOptimum_AndCertificateIsDualFeasible(int seed)
    {
        // Network form: a two-leg divider judged on its ratio in the worst case, so two parts off together make a good
        // set (error cancellation); the top leg may be a series pair on odd seeds. Every feasible set is enumerated.
        var rng = new Random(93_000 + seed);
        var seriesTop = seed % 2 == 1;
        const double tolPpm = 300;
        var recipe = RandomInstances.Divider(seriesTop, tolPpm);
        double[] nominals = seriesTop ? [10e3, 5e3] : [10e3];
        var parts = RandomInstances.Parts(rng, rng.Next(5, 9), nominals, sigma: 1.5e-3, maxRelU: 30e-6);
        var judge = BruteForce.Divider(recipe, tolPpm);
        var (optimum, _) = BruteForce.Solve(recipe, parts, judge);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var r = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false);
        Assert.NotNull(r);
        Assert.True(r.Bound >= optimum, $"seed {seed}: column bound {r.Bound} < optimum {optimum}");
        // Certificate (LP duality, textbook), checked against every block the brute force can arrange into a set.
        AssertDualFeasible(recipe, usable, judge, r, seed);

        var assembled = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts);
        Assert.True(assembled.UpperBound >= optimum, $"seed {seed}: bound {assembled.UpperBound} < {optimum}");
    }

    private static ColumnBoundResult Run(Recipe recipe, IReadOnlyList<PartCandidate> parts)
    {
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var r = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 0);
        Assert.NotNull(r);
        return r;
    }

    private static PartCandidate Part(int i, double deviation)
    {
        var v = 10e3 * (1 + deviation);
        return new(i + 1, 10e3, new MeasuredValue(v, v * 5e-6, v * 2.5e-6), null);
    }

    // y ≥ 0 and Σ_{i∈S} y_i ≥ m for every block S of the usable parts the brute force can arrange into a set.
    internal static void AssertDualFeasible(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        BruteForce.Judge judge,
        ColumnBoundResult r,
        int seed
    )
    {
        Assert.All(r.Duals, y => Assert.True(y >= 0));
        for (var mask = 1; mask < 1 << usable.Count; mask++)
        {
            if (BruteForce.BlockScore(recipe, usable, mask, judge) is not null)
            {
                var cost = Enumerable.Range(0, usable.Count).Where(i => (mask >> i & 1) == 1).Sum(i => r.Duals[i]);
                Assert.True(cost >= r.MinSetCost - 1e-9, $"seed {seed}: set {mask} costs {cost} < m {r.MinSetCost}");
            }
        }
    }
}
