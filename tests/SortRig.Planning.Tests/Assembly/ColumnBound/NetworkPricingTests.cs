using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly.ColumnBound;

/// <summary>
/// The reel-scale network pricing of the column LP (<see cref="NetworkPricing"/>) on instances small enough to check
/// against referees: its family holds every set the independent brute force's arrangement search finds feasible; its
/// bound is never below the exact optimum; its certificate is dual feasible over those sets; and when it converges it
/// is the LP of the enumerated pricing (both are the set-packing LP over every feasible set; LP duality, textbook).
/// </summary>
public sealed class NetworkPricingTests
{
    private static readonly AssemblyOptions Defaults = new();

    private static readonly Recipe s_decade = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("decade-divider.yaml")),
        "decade-divider.yaml"
    );

    private static readonly Recipe s_amp = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("diff-amp-g10.yaml")),
        "diff-amp-g10.yaml"
    );

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 12));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void DecadeDivider_WithParallelPairs(int seed)
    {
        // R3 may be a parallel pair of 2k parts; σ 300 ppm against 200/400 ppm specs, so legs off together matter.
        var rng = new Random(95_000 + seed);
        var parts = RandomInstances.Parts(rng, 12, [90e3, 9e3, 1e3, 2e3], sigma: 300e-6, maxRelU: 20e-6);
        Check(s_decade, parts, seed);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void DiffAmpG10(int seed)
    {
        var rng = new Random(96_000 + seed);
        var parts = RandomInstances.Parts(rng, 14, [1e3, 10e3], sigma: 400e-6, maxRelU: 20e-6);
        Check(s_amp, parts, seed);
    }

    public static TheoryData<int> DividerSeeds => new(Enumerable.Range(0, 20));

    [Theory]
    [MemberData(nameof(DividerSeeds))]
    public void TwoLegDivider_NeverBelowBruteForceOptimum(int seed)
    {
        // Two-leg divider (top leg a series pair on odd seeds), referee: the brute force over every partition.
        var rng = new Random(93_000 + seed);
        var seriesTop = seed % 2 == 1;
        var recipe = RandomInstances.Divider(seriesTop, 300);
        double[] nominals = seriesTop ? [10e3, 5e3] : [10e3];
        var parts = RandomInstances.Parts(rng, rng.Next(5, 9), nominals, sigma: 1.5e-3, maxRelU: 30e-6);
        var judge = BruteForce.Divider(recipe, 300);
        var (optimum, _) = BruteForce.Solve(recipe, parts, judge);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var r = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 0);
        if (r is null)
        {
            // No set in the family at all: then the brute force finds none either.
            Assert.Equal(0, optimum);
            return;
        }

        Assert.Contains("interval", r.Family, StringComparison.Ordinal);
        Assert.True(r.Bound >= optimum, $"seed {seed}: bound {r.Bound} < optimum {optimum}");
        ColumnBoundTests.AssertDualFeasible(recipe, usable, judge, r, seed);
    }

    private static void Check(Recipe recipe, List<PartCandidate> parts, int seed)
    {
        var exact = new SetAssembler().Assemble(recipe, parts);
        Assert.Equal(AssemblyMethod.Exact, exact.Method);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var judge = Judge(recipe);

        // The family holds every feasible set: every block of parts that the brute force's own arrangement search
        // (every position order, every pair) finds feasible is a member.
        var pricing = NetworkPricing.TryCreate(recipe, usable, Defaults, () => false);
        if (pricing is null)
        {
            // Only when some position has no part at all (then no set exists).
            Assert.Empty(exact.Sets);
            Assert.Contains(recipe.Positions, p => !usable.Any(u => CandidatePool.Wanted(p, u.Nominal, Defaults)));
            return;
        }

        var feasible = 0;
        for (var mask = 1; mask < 1 << usable.Count; mask++)
        {
            if (
                int.PopCount(mask) >= recipe.Positions.Count
                && int.PopCount(mask) <= 2 * recipe.Positions.Count
                && BruteForce.BlockScore(recipe, usable, mask, judge) is not null
            )
            {
                feasible++;
                var members = Enumerable.Range(0, usable.Count).Where(i => (mask >> i & 1) == 1).ToArray();
                Assert.True(pricing.Covers(members), $"seed {seed}: feasible set {mask} not in the family");
            }
        }

        var network = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 0);
        var enumerated = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 64);
        if (feasible == 0)
        {
            Assert.Empty(exact.Sets);
            return;
        }

        Assert.NotNull(network);
        Assert.NotNull(enumerated);
        Assert.Contains("interval", network.Family, StringComparison.Ordinal);
        Assert.True(network.Bound >= exact.Sets.Count, $"seed {seed}: bound {network.Bound} < {exact.Sets.Count}");
        ColumnBoundTests.AssertDualFeasible(recipe, usable, judge, network, seed);
        // Never below the enumerated LP beyond rounding, and equal to it when both reached the LP optimum.
        Assert.True(network.Value >= enumerated.Value - 1e-6, $"seed {seed}: {network.Value} < {enumerated.Value}");
        if (network.Converged && enumerated.Converged)
        {
            Assert.Equal(enumerated.Value, network.Value, 6);
        }
    }

    // The real worst-case rule through the public evaluator (|error| + Σ |∂error/∂R| U per output), arranged by the
    // brute force; the evaluator's sensitivities are checked against finite differences in the network tests.
    private static BruteForce.Judge Judge(Recipe recipe) =>
        fills =>
        {
            var values = recipe.Positions.Select((p, k) => (p.Name, fills[k].Value)).ToDictionary();
            var u = recipe.Positions.Select((p, k) => (p.Name, fills[k].U)).ToDictionary();
            var checks = NetworkEvaluator.Evaluate(recipe, values, u);
            return checks.All(c => c.Meets) ? checks.Max(c => c.Score) : null;
        };
}
