using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// A proven upper bound on the number of sets by counting parts. For every non-empty subset C of the recipe's nominal
/// classes, each set needs Σ_{j∈C} Demand[j] fills of those classes; a part can give at most one fill (as a single of a
/// class in C) or half a fill (as one of a series or parallel pair for a class in C). So sets ≤ ⌊supply(C) / demand(C)⌋
/// (a Hall-type counting condition). Matched form: a part counts as a single only when its interval of admissible
/// common points holds, somewhere, enough intervals of every class without pairs (exact 1-D test, slightly widened):
/// no feasible set can contain it otherwise. Network form (at most <see cref="NetworkPartFilter.MaxPositions"/>
/// positions): likewise when no set of values within the reel's range can meet every output with it
/// (<see cref="NetworkPartFilter"/>, a proven relaxation). The same filtered counts then feed the supply LP
/// (<see cref="SupplyBound"/>), which also sees that a part in a pair gives half a fill; the smaller bound is returned.
/// </summary>
internal static class PartCountBound
{
    public const string MatchedName =
        "part-count bound (Hall condition and supply LP over nominal classes; parts that fit no common window not "
        + "counted)";
    public const string NetworkName = "part-count bound (Hall condition and supply LP over nominal classes)";
    public const string NetworkFilteredName =
        "part-count bound (Hall condition and supply LP over nominal classes; parts that no set within the reel's "
        + "range can hold not counted)";

    /// <summary>The bound and its description.</summary>
    public static (int Bound, string Name) ComputeNamed(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options,
        Func<bool>? stop = null
    )
    {
        var bound = Compute(recipe, usable, rule, options, stop);
        var name =
            recipe.Form == RecipeForm.Matched ? MatchedName
            : recipe.Positions.Count <= NetworkPartFilter.MaxPositions ? NetworkFilteredName
            : NetworkName;
        return (bound, name);
    }

    // stop: the network filter's budget; once true, the remaining parts are counted unfiltered (always valid).
    public static int Compute(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options,
        Func<bool>? stop = null
    )
    {
        var geo = new SweepGeometry(recipe, rule);
        var classes = geo.Nominals.Length;
        var pairClass = new bool[classes];
        var seriesOk = new bool[classes];
        var parallelOk = new bool[classes];
        for (var k = 0; k < recipe.Positions.Count; k++)
        {
            var c = geo.ClassOf[k];
            seriesOk[c] |= recipe.Positions[k].Pairs.HasFlag(PairBuilds.Series);
            parallelOk[c] |= recipe.Positions[k].Pairs.HasFlag(PairBuilds.Parallel);
            pairClass[c] = seriesOk[c] || parallelOk[c];
        }

        Func<int, int, bool>? fits =
            recipe.Form == RecipeForm.Matched ? new WindowFilter(geo, usable, options, pairClass).Fits
            : NetworkPartFilter.TryCreate(recipe, rule, geo, usable, options) is { } network
                ? (j, i) => stop?.Invoke() == true || network.Fits(j, i)
            : null;
        // single[i] / half[i]: class bit masks the part can fill as a single / as half a pair.
        var single = new int[usable.Count];
        var half = new int[usable.Count];
        // Farthest from nominal first: those are the parts a filter can drop, so a time budget is spent on them.
        foreach (
            var i in Enumerable
                .Range(0, usable.Count)
                .OrderByDescending(i => Math.Abs(Math.Log(usable[i].Value.Value / usable[i].Nominal)))
                .ThenBy(i => i)
        )
        {
            var n = usable[i].Nominal;
            for (var j = 0; j < classes; j++)
            {
                if (options.SameNominal(n, geo.Nominals[j]) && (fits is null || fits(j, i)))
                {
                    single[i] |= 1 << j;
                }

                if (
                    (seriesOk[j] && options.SameNominal(n, geo.Nominals[j] / 2))
                    || (parallelOk[j] && options.SameNominal(n, geo.Nominals[j] * 2))
                )
                {
                    half[i] |= 1 << j;
                }
            }
        }

        var bound = SupplyBound.Compute(recipe, usable, single, geo.ClassOf, options);
        for (var subset = 1; subset < 1 << Math.Min(classes, 12); subset++)
        {
            var demand = 0;
            for (var j = 0; j < classes; j++)
            {
                demand += (subset >> j & 1) == 1 ? geo.Demand[j] : 0;
            }

            var supply = 0.0;
            for (var i = 0; i < usable.Count; i++)
            {
                supply +=
                    (single[i] & subset) != 0 ? 1.0
                    : (half[i] & subset) != 0 ? 0.5
                    : 0.0;
            }

            bound = Math.Min(bound, (int)Math.Floor((supply / demand) + 1e-9));
        }

        return bound == int.MaxValue ? 0 : bound;
    }
}
