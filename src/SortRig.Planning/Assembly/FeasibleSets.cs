using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Every feasible assignment of options to positions (pruned by the ratio window in the matched form, identical
/// matched-form positions taken in canonical order), keeping the best-scoring assignment per part subset.
/// </summary>
internal sealed class FeasibleSets(Recipe recipe, CandidatePool pool, ISetRule rule, AssemblyOptions limits)
{
    private readonly Dictionary<ulong, int> _bestByMask = [];
    private long _leaves;

    public List<(ulong Mask, double Score, Option[] Fills, SetVerdict Verdict)> Sets { get; } = [];

    /// <summary>Enumerates; false when more than <see cref="AssemblyOptions.ExactSetLimit"/> assignments would be
    /// judged.</summary>
    public bool Enumerate()
    {
        var fills = new Option[recipe.Positions.Count];
        var symmetric = recipe
            .Positions.Select(
                (p, k) =>
                    rule is MatchedRule
                    && k > 0
                    && p.Nominal == recipe.Positions[k - 1].Nominal
                    && p.Pairs == recipe.Positions[k - 1].Pairs
            )
            .ToArray();
        return Enumerate(0, 0UL, fills, symmetric, double.PositiveInfinity, double.NegativeInfinity, -1);
    }

    private bool Enumerate(int k, ulong used, Option[] fills, bool[] symmetric, double lo, double hi, int previous)
    {
        if (k == fills.Length)
        {
            if (++_leaves > limits.ExactSetLimit)
            {
                return false;
            }

            var verdict = rule.Judge(fills);
            if (!verdict.Meets)
            {
                return true;
            }

            var entry = (used, verdict.Score, (Option[])fills.Clone(), verdict);
            if (!_bestByMask.TryGetValue(used, out var at))
            {
                _bestByMask[used] = Sets.Count;
                Sets.Add(entry);
            }
            else if (verdict.Score < Sets[at].Score)
            {
                Sets[at] = entry;
            }

            return true;
        }

        var options = pool.Options[k];
        for (var i = symmetric[k] ? previous + 1 : 0; i < options.Count; i++)
        {
            var o = options[i];
            if ((o.Mask & used) != 0)
            {
                continue;
            }

            double nlo = lo,
                nhi = hi;
            if (rule is MatchedRule m)
            {
                nlo = Math.Min(lo, m.Lo(k, o));
                nhi = Math.Max(hi, m.Hi(k, o));
                if (nhi - nlo > m.Window * (1 + 1e-9))
                {
                    continue;
                }
            }

            fills[k] = o;
            if (!Enumerate(k + 1, used | o.Mask, fills, symmetric, nlo, nhi, i))
            {
                return false;
            }
        }

        return true;
    }
}
