using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The neighbourhood search's pair release (a leftover single takes a pair's place, along an augmenting path of
/// sets): a hand-derived chain, the invariants on plans from the sweep (every set still meets the rule by the
/// independent judge of <see cref="BruteForce"/>, no part twice, as many sets, one pair fewer per release), and the
/// whole reel-scale path where releases happen against the independent brute force's optimum (<see
/// cref="BruteForce.Solve"/>, every partition of the parts).
/// </summary>
public sealed class PairReleaseTests
{
    private static readonly Recipe s_shape = RandomInstances.Matched(4); // A 10k; B 20k or two 10k in series

    [Fact]
    public void LeftoverSingle_MovesASingleOn_WhichFreesAPair()
    {
        // Hand-derived (1 000 ppm window, 1 ppm uncertainty): set 1 = A 10k +800 ppm, B 20k +800; set 2 = A 10k +300,
        // B = 10k +100 in series with 10k +500 (about +300). The leftover 20k at +1 700 fits set 1 only (900 ppm from
        // its A; 1 400 from set 2's), and set 1's 20k at +800 then fits set 2 (500 ppm), whose pair is freed.
        var parts = new List<PartCandidate>
        {
            Part(1, 10e3, 800),
            Part(2, 20e3, 800),
            Part(3, 10e3, 300),
            Part(4, 10e3, 100),
            Part(5, 10e3, 500),
            Part(6, 20e3, 1700),
        };
        var rule = new MatchedRule(s_shape);
        var sets = new List<(Option[] Fills, SetVerdict Verdict)>
        {
            Set(rule, Option.Single(0, parts[0]), Option.Single(1, parts[1])),
            Set(rule, Option.Single(2, parts[2]), Option.Pair(PositionBuild.Series, 3, parts[3], 4, parts[4])),
        };
        Assert.All(sets, s => Assert.True(s.Verdict.Meets));

        var search = new NeighbourhoodSearch(s_shape, parts, rule, new AssemblyOptions());
        Assert.Equal(1, search.ReleasePairs(sets, CancellationToken.None));

        Assert.Equal([0, 5], sets[0].Fills.Select(f => f.A));
        Assert.Equal([2, 1], sets[1].Fills.Select(f => f.A));
        Assert.All(sets.SelectMany(s => s.Fills), f => Assert.Equal(-1, f.B));
        AssertValid(parts, sets);
    }

    [Fact]
    public void NoSlotForTheLeftover_NothingChanges()
    {
        // The leftover 20k at +2 500 ppm is 1 700 and 2 200 ppm from the two A parts: over the 1 000 ppm window.
        var parts = new List<PartCandidate>
        {
            Part(1, 10e3, 800),
            Part(2, 20e3, 800),
            Part(3, 10e3, 300),
            Part(4, 10e3, 100),
            Part(5, 10e3, 500),
            Part(6, 20e3, 2500),
        };
        var rule = new MatchedRule(s_shape);
        var sets = new List<(Option[] Fills, SetVerdict Verdict)>
        {
            Set(rule, Option.Single(0, parts[0]), Option.Single(1, parts[1])),
            Set(rule, Option.Single(2, parts[2]), Option.Pair(PositionBuild.Series, 3, parts[3], 4, parts[4])),
        };
        var before = sets.ToList();

        Assert.Equal(
            0,
            new NeighbourhoodSearch(s_shape, parts, rule, new AssemblyOptions()).ReleasePairs(sets, default)
        );
        Assert.Equal(before, sets);
    }

    // Shapes with a parallel pair (3: two positions; 5: three, a series pair too). The sweep fills shape 4's series
    // position with every 20k single before it pairs 10k parts, so its plans leave no 20k to release with.
    [Theory]
    [InlineData(3)]
    [InlineData(5)]
    public void OnSweepPlans_SetsStayValid_PartsOnce_OnePairFewerPerRelease(int shape)
    {
        var recipe = RandomInstances.Matched(shape);
        var rule = new MatchedRule(recipe);
        var judge = BruteForce.Matched(recipe);
        var released = 0;
        for (var seed = 0; seed < 40; seed++)
        {
            var parts = RandomInstances.Parts(
                new Random(91_000 + seed),
                60,
                ReelScaleReferee.Nominals(recipe),
                sigma: 1500e-6,
                maxRelU: 150e-6
            );
            var options = new AssemblyOptions(exactPartLimit: 0);
            var pool = new CandidatePool(recipe, parts, options, withPairs: false);
            var sets = new SweepPlanner(recipe, pool, rule, options).Run();
            var (count, pairs) = (sets.Count, Pairs(sets));
            var freed = new NeighbourhoodSearch(recipe, pool.Usable, rule, options).ReleasePairs(sets, default);
            released += freed;
            Assert.Equal(count, sets.Count);
            Assert.Equal(pairs - freed, Pairs(sets));
            AssertValid(pool.Usable, sets, judge);
        }

        // The path must have been taken, or this test checks nothing.
        Assert.True(released > 0, "no release on any plan");
    }

    [Fact]
    public void ReelScalePath_WithReleases_NeverAboveTheBruteForceOptimum()
    {
        // Windows of two sets' parts, so the search cannot solve the whole instance at once; 10 parts, so the
        // independent brute force finishes.
        var withRelease = 0;
        for (var c = 0; c < 90; c++)
        {
            var shape = 3 + (c % 3);
            var recipe = RandomInstances.Matched(shape);
            var parts = RandomInstances.Parts(
                new Random(92_000 + c),
                10,
                ReelScaleReferee.Nominals(recipe),
                sigma: 700e-6,
                maxRelU: 150e-6
            );
            var result = ReelScaleReferee.Check(
                recipe,
                parts,
                BruteForce.Matched(recipe),
                2 * recipe.Positions.Count,
                $"case {c}"
            );
            withRelease += result.Note.Contains("given back", StringComparison.Ordinal) ? 1 : 0;
        }

        Assert.True(withRelease > 0, "no instance took the release path");
    }

    private static int Pairs(List<(Option[] Fills, SetVerdict Verdict)> sets) =>
        sets.Sum(s => s.Fills.Count(f => f.B >= 0));

    private static (Option[] Fills, SetVerdict Verdict) Set(MatchedRule rule, params Option[] fills) =>
        (fills, rule.Judge(fills));

    private static PartCandidate Part(int id, double nominal, double ppm)
    {
        var v = nominal * (1 + (ppm * 1e-6));
        return new PartCandidate(id, nominal, new MeasuredValue(v, v * 1e-6, v * 0.5e-6), $"T1-A{id:00}");
    }

    private static void AssertValid(
        IReadOnlyList<PartCandidate> parts,
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        BruteForce.Judge? judge = null
    )
    {
        judge ??= BruteForce.Matched(s_shape);
        var ids = sets.SelectMany(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A])).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
        foreach (var (fills, verdict) in sets)
        {
            Assert.True(verdict.Meets);
            // Pair values by the textbook series/parallel formulas, each part's uncertainty added in the worst case.
            var judged = fills
                .Select(f =>
                    f.B < 0 ? (parts[f.A].Value.Value, parts[f.A].Value.ExpandedTransfer)
                    : f.Build == PositionBuild.Series
                        ? (
                            parts[f.A].Value.Value + parts[f.B].Value.Value,
                            parts[f.A].Value.ExpandedTransfer + parts[f.B].Value.ExpandedTransfer
                        )
                    : Parallel(parts[f.A].Value, parts[f.B].Value)
                )
                .ToList();
            Assert.True(judge(judged) is not null, "a set fails the referee's judge");
        }
    }

    // R = r1 r2 / (r1 + r2); ∂R/∂r1 = r2² / (r1 + r2)², ∂R/∂r2 = r1² / (r1 + r2)² (textbook calculus).
    private static (double, double) Parallel(MeasuredValue a, MeasuredValue b)
    {
        var (r1, r2) = (a.Value, b.Value);
        var s2 = (r1 + r2) * (r1 + r2);
        return ((r1 * r2) / (r1 + r2), ((r2 * r2 * a.ExpandedTransfer) + (r1 * r1 * b.ExpandedTransfer)) / s2);
    }
}
