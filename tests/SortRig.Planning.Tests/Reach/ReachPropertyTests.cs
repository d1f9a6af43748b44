using FsCheck;
using FsCheck.Fluent;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Reach;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Reach;

public sealed class ReachPropertyTests
{
    private static readonly Recipe s_pair = RecipeLoader.Load(
        "recipe: pair\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: A, nominal: 10k }\n  - { name: B, "
            + "nominal: 10k }\n",
        "pair.yaml"
    );

    /// <summary>
    /// Most disjoint pairs within ratio m from sorted values (no uncertainty): scan neighbours, pair them when
    /// x[i+1]/x[i] − 1 ≤ m and skip both, else move on. Optimal by the usual exchange argument (derived here): in any
    /// optimum, if the lowest free part is paired with some later part within m, its neighbour is within m too and can
    /// take that partner's place; if the lowest is unpaired but its neighbour pairs further up, swapping the
    /// neighbour's partner for the lowest keeps the count.
    /// </summary>
    private static int GreedyPairs(double[] sorted, double m)
    {
        var count = 0;
        for (var i = 0; i + 1 < sorted.Length; )
        {
            if ((sorted[i + 1] / sorted[i]) - 1 <= m)
            {
                count++;
                i += 2;
            }
            else
            {
                i++;
            }
        }

        return count;
    }

    [Fact]
    public void ReachBracket_HoldsTheExactThreshold_OnRandomReels()
    {
        // The exact threshold for N pairs is the smallest neighbour ratio at which the greedy count reaches N; the
        // reach's final bracket (tighter end, reported match] must contain it.
        var cases = Gen.Choose(0, 1_000_000)
            .Select(seed =>
            {
                var rng = new Random(seed);
                var values = Enumerable
                    .Range(0, rng.Next(4, 21))
                    .Select(_ => 1 + ((rng.NextDouble() - 0.5) * 0.02))
                    .ToArray();
                return (values, sets: rng.Next(1, (values.Length / 2) + 1));
            });
        Prop.ForAll(cases.ToArbitrary(), c =>
            {
                var sorted = c.values.Order().ToArray();
                var threshold =
                    sorted
                        .Zip(sorted.Skip(1), (a, b) => (b / a) - 1)
                        .Order()
                        .First(m => GreedyPairs(sorted, m) >= c.sets) * 1e6;
                var parts = c
                    .values.Select((v, i) => new PartCandidate(i, 10e3, new MeasuredValue(10e3 * v, 0, 0), null))
                    .ToList();
                var reach = new OnHandReach().Find(s_pair, parts, c.sets, precision: 0.01, scanPoints: 10);
                return reach.TighterScale * 1000 < threshold * (1 + 1e-9)
                    && threshold <= reach.MatchPpm!.Value * (1 + 1e-9)
                    && reach.SetsAtScale >= c.sets
                    && reach.SetsAtTighter < c.sets;
            })
            .Check(Config.QuickThrowOnFailure.WithMaxTest(200).WithQuietOnSuccess(true));
    }
}
