using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Exact pricing for any recipe form on small instances: every feasible set is enumerated once by
/// <see cref="FeasibleSets"/> (every assignment judged by the real worst-case rule, so a divider's legs may be off
/// together), and each pricing takes the minimum over that explicit list. Null when the enumeration exceeds its limit.
/// </summary>
internal sealed class EnumeratedPricing : IColumnPricing
{
    private readonly List<int[]> _sets;

    private EnumeratedPricing(List<int[]> sets) => _sets = sets;

    public string Family => "every feasible set, enumerated";

    public static EnumeratedPricing? TryCreate(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options
    )
    {
        var pool = new CandidatePool(recipe, usable, options, withPairs: true);
        var all = new FeasibleSets(recipe, pool, rule, options);
        if (pool.Usable.Count != usable.Count || !all.Enumerate())
        {
            return null;
        }

        var sets = all
            .Sets.Select(s => Enumerable.Range(0, usable.Count).Where(i => (s.Mask >> i & 1) == 1).ToArray())
            .ToList();
        return new EnumeratedPricing(sets);
    }

    public PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop)
    {
        var min = double.PositiveInfinity;
        var found = new List<(double Cost, int[] Parts)>();
        foreach (var s in _sets)
        {
            var cost = 0.0;
            foreach (var i in s)
            {
                cost += duals[i];
            }

            min = Math.Min(min, cost);
            if (cost < 1 - 1e-9)
            {
                found.Add((cost, s));
            }
        }

        return new PricingResult(min, MatchedPricing.Spread(found, maxColumns));
    }
}
