using System.Numerics;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Exact search for small instances: enumerates every feasible assignment (pruned by the ratio window in the matched
/// form, identical positions taken in canonical order), keeps the best-scoring assignment per part subset, then packs
/// subsets by memoised branching on the lowest free part (take it in some set, or leave it unused).
/// Maximises the set count, then minimises the sum of set scores. Returns null when a limit is exceeded.
/// </summary>
internal sealed class ExactPacker(Recipe recipe, CandidatePool pool, ISetRule rule, AssemblyOptions limits)
{
    private readonly List<(ulong Mask, double Score, Option[] Fills, SetVerdict Verdict)> _sets = [];
    private readonly Dictionary<ulong, int> _bestByMask = [];
    private readonly Dictionary<ulong, (int Count, double Score, int Choice)> _memo = [];
    private List<int>[] _byPart = [];
    private long _leaves;

    public List<(Option[] Fills, SetVerdict Verdict)>? Solve()
    {
        var fills = new Option[recipe.Positions.Count];
        var symmetric = recipe.Positions.Select((p, k) => rule is MatchedRule && k > 0
            && p.Nominal == recipe.Positions[k - 1].Nominal && p.Pairs == recipe.Positions[k - 1].Pairs).ToArray();
        if (!Enumerate(0, 0UL, fills, symmetric, double.PositiveInfinity, double.NegativeInfinity, -1))
        {
            return null;
        }

        _byPart = Enumerable.Range(0, pool.Usable.Count).Select(_ => new List<int>()).ToArray();
        for (var s = 0; s < _sets.Count; s++)
        {
            for (var m = _sets[s].Mask; m != 0; m &= m - 1)
            {
                _byPart[BitOperations.TrailingZeroCount(m)].Add(s);
            }
        }

        var all = pool.Usable.Count == 64 ? ulong.MaxValue : (1UL << pool.Usable.Count) - 1;
        try
        {
            Best(all);
        }
        catch (LimitExceededException)
        {
            return null;
        }

        var result = new List<(Option[], SetVerdict)>();
        for (var avail = all; _memo.TryGetValue(avail, out var node) && node.Count > 0;)
        {
            if (node.Choice < 0)
            {
                avail &= ~LowestCovered(avail);
                continue;
            }

            var set = _sets[node.Choice];
            result.Add((set.Fills, set.Verdict));
            avail &= ~set.Mask;
        }

        return result;
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
                _bestByMask[used] = _sets.Count;
                _sets.Add(entry);
            }
            else if (verdict.Score < _sets[at].Score)
            {
                _sets[at] = entry;
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

            double nlo = lo, nhi = hi;
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

    private (int Count, double Score) Best(ulong avail)
    {
        if (_memo.TryGetValue(avail, out var hit))
        {
            return (hit.Count, hit.Score);
        }

        var low = LowestCovered(avail);
        if (low == 0)
        {
            return (0, 0.0);
        }

        var (count, score) = Best(avail & ~low);
        var choice = -1;
        foreach (var s in _byPart[BitOperations.TrailingZeroCount(low)])
        {
            var (mask, setScore, _, _) = _sets[s];
            if ((mask & ~avail) != 0)
            {
                continue;
            }

            var rest = Best(avail & ~mask);
            if (rest.Count + 1 > count || (rest.Count + 1 == count && rest.Score + setScore < score - 1e-12))
            {
                (count, score, choice) = (rest.Count + 1, rest.Score + setScore, s);
            }
        }

        if (_memo.Count >= limits.ExactStateLimit)
        {
            throw new LimitExceededException();
        }

        _memo[avail] = (count, score, choice);
        return (count, score);
    }

    private ulong LowestCovered(ulong avail)
    {
        for (var m = avail; m != 0; m &= m - 1)
        {
            var p = BitOperations.TrailingZeroCount(m);
            if (_byPart[p].Count > 0)
            {
                return 1UL << p;
            }
        }

        return 0;
    }

    private sealed class LimitExceededException : Exception;
}
