using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The neighbourhood search's set completion (leftovers that fit one window, their missing positions brought in along
/// chains of sets): a hand-derived chain, the invariants on plans from the sweep, and the whole reel-scale path against
/// the independent brute force's optimum (<see cref="BruteForce.Solve"/>, every partition of the parts), every set
/// judged again by the brute force's own matched rule.
/// </summary>
public sealed class SetCompletionTests
{
    [Fact]
    public void TwoLeftovers_TakeAThirdPart_FromASetThatTakesAFarLeftover()
    {
        // Three 10k positions, 1 000 ppm window, 1 ppm uncertainty (hand-derived). Set {+700, +800, +1 100 ppm};
        // leftovers at +300, +1 500 and +1 600. The two high leftovers need a third part within 1 000 ppm: the set
        // gives one (+700 or +1 100) and takes the +300 leftover in its place, still within 800 ppm. Two sets of
        // three from six parts: the optimum.
        var recipe = RandomInstances.Matched(1);
        var parts = new[] { 700, 800, 1100, 300, 1500, 1600 }.Select((ppm, i) => Part(i + 1, ppm)).ToList();
        var rule = new MatchedRule(recipe);
        var start = new[] { Option.Single(0, parts[0]), Option.Single(1, parts[1]), Option.Single(2, parts[2]) };
        var sets = new List<(Option[] Fills, SetVerdict Verdict)> { (start, rule.Judge(start)) };
        Assert.True(sets[0].Verdict.Meets);

        var added = new NeighbourhoodSearch(recipe, parts, rule, new AssemblyOptions()).CompleteSets(sets, default);

        Assert.Equal(1, added);
        Assert.Equal(2, sets.Count);
        AssertValid(recipe, parts, sets);
        Assert.Equal(6, sets.SelectMany(s => s.Fills).Select(f => f.A).Distinct().Count());
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(5)]
    public void OnSweepPlans_OnlyAddsValidSets_PartsOnce(int shape)
    {
        var recipe = RandomInstances.Matched(shape);
        var rule = new MatchedRule(recipe);
        for (var seed = 0; seed < 30; seed++)
        {
            var parts = RandomInstances.Parts(
                new Random(93_000 + seed),
                60,
                ReelScaleReferee.Nominals(recipe),
                sigma: 1500e-6,
                maxRelU: 300e-6
            );
            var options = new AssemblyOptions(exactPartLimit: 0);
            var pool = new CandidatePool(recipe, parts, options, withPairs: false);
            var sets = new SweepPlanner(recipe, pool, rule, options).Run();
            var before = sets.Count;
            var added = new NeighbourhoodSearch(recipe, pool.Usable, rule, options).CompleteSets(sets, default);
            Assert.Equal(before + added, sets.Count);
            AssertValid(recipe, pool.Usable, sets);
        }
    }

    [Fact]
    public void ReelScalePath_NeverAboveTheBruteForceOptimum()
    {
        for (var c = 0; c < 60; c++)
        {
            var shape = c % RandomInstances.MatchedShapes.Length;
            var recipe = RandomInstances.Matched(shape);
            var parts = RandomInstances.Parts(
                new Random(94_000 + c),
                10,
                ReelScaleReferee.Nominals(recipe),
                sigma: 900e-6,
                maxRelU: 200e-6
            );
            var result = ReelScaleReferee.Check(
                recipe,
                parts,
                BruteForce.Matched(recipe),
                2 * recipe.Positions.Count,
                $"case {c}"
            );
        }
    }

    private static PartCandidate Part(int id, double ppm)
    {
        var v = 10e3 * (1 + (ppm * 1e-6));
        return new PartCandidate(id, 10e3, new MeasuredValue(v, v * 1e-6, v * 0.5e-6), $"T1-A{id:00}");
    }

    private static void AssertValid(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        List<(Option[] Fills, SetVerdict Verdict)> sets
    )
    {
        var judge = BruteForce.Matched(recipe);
        var ids = sets.SelectMany(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A])).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
        foreach (var (fills, verdict) in sets)
        {
            Assert.True(verdict.Meets);
            // Singles judged from the parts themselves; pairs from the fill (their formulas are checked elsewhere).
            var judged = fills
                .Select(f =>
                    f.B < 0 ? (parts[f.A].Value.Value, parts[f.A].Value.ExpandedTransfer) : (f.Value, f.Uncertainty)
                )
                .ToList();
            Assert.True(judge(judged) is not null, "a set fails the referee's judge");
        }
    }
}
