using System.Numerics;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Exact packing for small instances: from every feasible part subset (<see cref="FeasibleSets"/>), branches on the
/// lowest free part (leave it unused, or take one set containing it), memoised on the set of free parts.
/// Maximises the set count, then minimises the sum of set scores. Returns null when a limit is exceeded.
/// </summary>
internal sealed class ExactPacker(Recipe recipe, CandidatePool pool, ISetRule rule, AssemblyOptions limits)
{
    private readonly Dictionary<ulong, (int Count, double Score, int Choice)> _memo = [];
    private List<(ulong Mask, double Score, Option[] Fills, SetVerdict Verdict)> _sets = [];
    private List<int>[] _byPart = [];

    public List<(Option[] Fills, SetVerdict Verdict)>? Solve()
    {
        var feasible = new FeasibleSets(recipe, pool, rule, limits);
        if (!feasible.Enumerate())
        {
            return null;
        }

        _sets = feasible.Sets;
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
        for (var avail = all; _memo.TryGetValue(avail, out var node) && node.Count > 0; )
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
