using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Assembly.Packing;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly.Packing;

/// <summary>
/// Packing the column LP's sets again (<see cref="PoolPacker"/>) on decade-divider instances small enough for the exact
/// search (the referee): every set meets every spec in the worst case through the public network evaluator, no part
/// is used twice, the count never exceeds the exact optimum, and when an exact cover at the LP's minimum cost is found
/// its count is the LP value and the exact optimum (complementary slackness, LP duality: textbook).
/// </summary>
public sealed class PoolPackerTests
{
    private static readonly AssemblyOptions Defaults = new();

    private static readonly Recipe s_decade = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("decade-divider.yaml")),
        "decade-divider.yaml"
    );

    [Fact]
    public void DecadeDivider_CoversMatchTheExactOptimum()
    {
        var covers = 0;
        for (var seed = 0; seed < 16; seed++)
        {
            var rng = new Random(77_000 + seed);
            var parts = RandomInstances.Parts(rng, 20, [90e3, 9e3, 1e3, 2e3], sigma: 300e-6, maxRelU: 20e-6);
            var exact = new SetAssembler().Assemble(s_decade, parts);
            Assert.Equal(AssemblyMethod.Exact, exact.Method);
            var usable = new CandidatePool(s_decade, parts, Defaults, withPairs: false).Usable;
            var rule = new NetworkRule(s_decade);
            var lp = ColumnBoundStep.Run(s_decade, usable, Defaults, [], () => false, enumerateParts: 0);
            if (lp is null)
            {
                Assert.Empty(exact.Sets);
                continue;
            }

            var (sets, how) = PoolPacker.Improve(s_decade, usable, rule, Defaults, lp, [], () => false);
            var used = new HashSet<int>();
            foreach (var (fills, _) in sets)
            {
                Assert.All(fills, f => Assert.True(used.Add(f.A) && (f.B < 0 || used.Add(f.B)), "part used twice"));
                var values = s_decade.Positions.Select((p, k) => (p.Name, fills[k].Value)).ToDictionary();
                var u = s_decade.Positions.Select((p, k) => (p.Name, fills[k].Uncertainty)).ToDictionary();
                Assert.All(NetworkEvaluator.Evaluate(s_decade, values, u), c => Assert.True(c.Meets, c.Name));
            }

            Assert.True(sets.Count <= exact.Sets.Count, $"seed {seed}: {sets.Count} > optimum {exact.Sets.Count}");
            if (how.StartsWith("exact cover", StringComparison.Ordinal))
            {
                covers++;
                Assert.Equal(exact.Sets.Count, sets.Count);
                Assert.Equal(lp.Value, sets.Count, 6);
            }
        }

        // Not vacuous: most of these instances have an integral LP whose columns hold a cover.
        Assert.True(covers >= 8, $"{covers} of 16 instances packed by an exact cover");
    }
}
