using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly.ColumnBound;

/// <summary>
/// The pooled master of the matched column LP at reel scale (<see cref="AggregatedColumnBound"/>): a textbook LP for
/// its simplex, and on small matched instances with series and parallel pairs, against the independent brute force:
/// never below the exact optimum, a dual-feasible certificate over every feasible set, never below the LP over the
/// enumerated feasible sets and equal to it once every part has a row of its own.
/// </summary>
public sealed class AggregatedColumnBoundTests
{
    private static readonly AssemblyOptions Defaults = new();

    // A scaled-down gain set of our own (1x as two 2k in parallel or a 1k, 2x, 2x, 4x as two 2k in series or a 4k).
    private static readonly Recipe GainSet = RecipeLoader.Load(
        "recipe: gain-set-test\nform: matched\nmatch-ppm: 500\nbase: 1k\npositions:\n"
            + "  - { name: RA, ratio: 1, pairs: [parallel] }\n  - { name: RB, ratio: 2 }\n  - { name: RC, ratio: 2 }\n"
            + "  - { name: RD, ratio: 4, pairs: [series] }\n",
        "gain-set-test.yaml"
    );

    [Fact]
    public void PackingMaster_TwoByTwoTextbookLp_ValueAndDuals()
    {
        // Textbook LP, solved by hand (LP duality, strong duality at the vertex): max x1 + x2 subject to
        // x1 + 2 x2 ≤ 4 and 3 x1 + x2 ≤ 6: optimum x = (8/5, 6/5), value 14/5, duals (2/5, 1/5). With each row
        // divided by its right-hand side the duals scale by it: (8/5, 6/5), and their sum is the value.
        var master = new PackingMaster(2);
        Assert.True(master.Add([(0, 1.0 / 4), (1, 3.0 / 6)]));
        Assert.True(master.Add([(0, 2.0 / 4), (1, 1.0 / 6)]));
        Assert.False(master.Add([(1, 1.0 / 6), (0, 2.0 / 4)]));
        Assert.True(master.Solve(1000, () => false));
        Assert.Equal(1.6, master.Duals[0], 3);
        Assert.Equal(1.2, master.Duals[1], 3);
        Assert.Equal(2.8, master.Duals[0] + master.Duals[1], 3);
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 30));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void Pooled_NeverBelowOptimumOrPartLp_EqualToPartLpWithEveryPartOnItsRow(int seed)
    {
        var (recipe, parts) = Instance(seed);
        var judge = BruteForce.Matched(recipe);
        var (optimum, _) = BruteForce.Solve(recipe, parts, judge);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var enumerated = EnumeratedPricing.TryCreate(recipe, usable, new MatchedRule(recipe), Defaults);
        Assert.NotNull(enumerated);
        // The reference: the set-packing LP over exactly the feasible sets, with a row per part.
        var partLp = ColumnBoundSolver.Solve(enumerated, usable.Count, [], () => false);
        Assert.NotNull(partLp);
        Assert.True(partLp.Converged);
        var (z, classOf) = ColumnBoundStep.Pooling(usable, Defaults);
        var window = new MatchedRule(recipe).Window;
        foreach (var own in new[] { 0, 1, 3 })
        {
            // Summing rows relaxes a packing programme (LP duality, textbook): the pooled LP is never below the part
            // LP, and its certificate holds over every feasible set.
            var pooled = AggregatedColumnBound.Solve(enumerated, z, classOf, window, [], () => false, own);
            Assert.NotNull(pooled);
            Assert.True(
                pooled.Value >= partLp.Value - 1e-6,
                $"seed {seed}, own {own}: {pooled.Value} < {partLp.Value}"
            );
            Assert.True(pooled.Bound >= optimum, $"seed {seed}, own {own}: bound {pooled.Bound} < optimum {optimum}");
            ColumnBoundTests.AssertDualFeasible(recipe, usable, judge, pooled, seed);

            // Up to every part on its own row the last stage is the part LP itself.
            var all = AggregatedColumnBound.Solve(
                enumerated,
                z,
                classOf,
                window,
                [],
                () => false,
                own,
                allStages: true
            );
            Assert.NotNull(all);
            Assert.True(all.Converged);
            Assert.Equal(partLp.Value, all.Value, 6);
        }

        // With the window pricing used at reel scale (a wider family): never below the optimum, certificate holds.
        var priced = AggregatedColumnBound.Solve(
            new MatchedPricing(recipe, usable, Defaults, ColumnBoundStep.GridSteps),
            z,
            classOf,
            window,
            [],
            () => false,
            firstOwn: 2
        );
        Assert.NotNull(priced);
        Assert.True(priced.Bound >= optimum, $"seed {seed}: window-priced bound {priced.Bound} < optimum {optimum}");
        Assert.True(priced.Value >= partLp.Value - 1e-6, $"seed {seed}: {priced.Value} < {partLp.Value}");
        ColumnBoundTests.AssertDualFeasible(recipe, usable, judge, priced, seed);
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void WindowPricing_TiedDuals_MinimumNeverAboveAnyFeasibleSet(int seed)
    {
        // Duals from a few values (many ties, many zeros: what a pooled master gives), where the pricing passes over
        // pairs whose part already has enough cheaper partners. Its minimum must stay a lower bound on Σ y over every
        // block the brute force can arrange into a set (the certificate's side of LP duality, textbook).
        var (recipe, parts) = Instance(seed);
        var judge = BruteForce.Matched(recipe);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var rng = new Random(97_000 + seed);
        double[] levels = [0, 0, 1.0 / 6, 1.0 / 3, 0.5];
        var y = usable.Select(_ => levels[rng.Next(levels.Length)]).ToArray();
        var min = new MatchedPricing(recipe, usable, Defaults, ColumnBoundStep.GridSteps).Price(y, 50, () => false).Min;
        var feasible = 0;
        for (var mask = 1; mask < 1 << usable.Count; mask++)
        {
            if (BruteForce.BlockScore(recipe, usable, mask, judge) is not null)
            {
                feasible++;
                var cost = Enumerable.Range(0, usable.Count).Where(i => (mask >> i & 1) == 1).Sum(i => y[i]);
                Assert.True(cost >= min - 1e-12, $"seed {seed}: set {mask} costs {cost} < pricing minimum {min}");
            }
        }

        Assert.True(feasible > 0 || double.IsPositiveInfinity(min), $"seed {seed}: no feasible set but min {min}");
    }

    [Fact]
    public void ScarcityOrder_PartWithoutNearbyPartnersComesFirst()
    {
        // Three nominals; the part of class 0 far from every class-1 part has no partner within a window there, so it
        // ranks first; the rest sit together (hand count, common practice, no source).
        double[] z = [0, 1e-4, -1e-4, 0.5e-4, 0.004, -0.5e-4];
        int[] classOf = [0, 1, 1, 2, 0, 2];
        var order = PartAggregation.ScarcityOrder(z, classOf, Math.Log(1 + 500e-6));
        Assert.Equal(4, order[0]);
        Assert.Equal(z.Length, order.Distinct().Count());
    }

    private static (Recipe Recipe, List<PartCandidate> Parts) Instance(int seed)
    {
        // Shapes with pairs of the referee tests and the gain set; parts crowded (σ 400 ppm) for a 500 ppm match so
        // that crowding, not counting, limits the sets.
        var rng = new Random(95_000 + seed);
        return (seed % 4) switch
        {
            0 => (RandomInstances.Matched(3, ppm: 500), Parts(rng, 6, 9, [10e3, 20e3])),
            1 => (RandomInstances.Matched(4, ppm: 500), Parts(rng, 6, 9, [10e3, 20e3, 10e3])),
            2 => (RandomInstances.Matched(5, ppm: 500), Parts(rng, 6, 10, [10e3, 20e3])),
            _ => (GainSet, Parts(rng, 7, 9, [1e3, 2e3, 2e3, 2e3, 4e3])),
        };
    }

    private static List<PartCandidate> Parts(Random rng, int min, int max, double[] nominals) =>
        RandomInstances.Parts(rng, rng.Next(min, max + 1), nominals, sigma: 400e-6, maxRelU: 60e-6);
}
