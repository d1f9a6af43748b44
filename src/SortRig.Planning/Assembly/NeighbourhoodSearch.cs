using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Large-neighbourhood search over a plan. Sets and leftover parts are ordered by their deviation z = ln(value /
/// marked nominal) (a set by its members' mean): feasible sets are local in z because every output is unchanged when
/// all parts move together. A window of neighbouring items holding at most <see
/// cref="AssemblyOptions.NeighbourhoodParts"/> parts is re-packed by the exact search (<see cref="ExactPacker"/>, every
/// feasible assignment judged by the real worst-case rule, so error cancellation counts); the window's sets are
/// replaced when the exact packing has more sets, or as many with a smaller sum of scores. Windows slide by half their
/// length; passes repeat until one changes nothing or the time runs out. Deterministic.
/// </summary>
internal sealed partial class NeighbourhoodSearch(
    Recipe recipe,
    IReadOnlyList<PartCandidate> usable,
    ISetRule rule,
    AssemblyOptions options
)
{
    private readonly AssemblyOptions _limits = new(
        exactPartLimit: 64,
        exactSetLimit: 200_000,
        exactStateLimit: 400_000,
        nominalMatchPpm: options.NominalMatchPpm,
        neighbourhoodParts: 0
    );
    private readonly double[] _z = usable.Select(p => Math.Log(p.Value.Value / p.Nominal)).ToArray();

    public int Passes { get; private set; }

    public int Replaced { get; private set; }

    /// <summary>True when a window can hold two sets, so a re-pack can gain one.</summary>
    public bool Applies => options.NeighbourhoodParts >= 2 * recipe.Positions.Count;

    public List<(Option[] Fills, SetVerdict Verdict)> Improve(
        List<(Option[] Fills, SetVerdict Verdict)> start,
        int bound,
        Func<bool> outOfTime,
        Action<int, int> passDone,
        CancellationToken cancellationToken
    )
    {
        var sets = new List<(Option[] Fills, SetVerdict Verdict)>(start);
        if (!Applies)
        {
            return sets;
        }

        for (var pass = 1; sets.Count < bound || pass == 1; pass++)
        {
            var changed = false;
            var items = Items(sets);
            for (var s = 0; s < items.Count; )
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (outOfTime())
                {
                    passDone(pass, sets.Count);
                    return sets;
                }

                var (e, parts) = (s, 0);
                while (e < items.Count && parts + items[e].Parts.Length <= options.NeighbourhoodParts)
                {
                    parts += items[e].Parts.Length;
                    e++;
                }

                if (e == s)
                {
                    s++;
                    continue;
                }

                var resumeKey = items[Math.Min(items.Count - 1, s + Math.Max(1, (e - s) / 2))].Key;
                var next = e == items.Count ? items.Count : s + Math.Max(1, (e - s) / 2);
                if (items.Skip(s).Take(e - s).Any(i => i.Set < 0) && TryRepack(sets, items.GetRange(s, e - s)))
                {
                    changed = true;
                    Replaced++;
                    items = Items(sets);
                    next = e == items.Count ? items.Count : items.FindIndex(i => i.Key >= resumeKey);
                    next = next < 0 ? items.Count : next;
                }

                s = next;
            }

            Passes = pass;
            passDone(pass, sets.Count);
            if (!changed)
            {
                break;
            }
        }

        Scatter(sets, bound, outOfTime, cancellationToken);
        passDone(Passes + 1, sets.Count);
        return sets;
    }

    private bool TryRepack(List<(Option[] Fills, SetVerdict Verdict)> sets, List<Item> window)
    {
        var sub = window.SelectMany(i => i.Parts).ToArray();
        var old = window.Where(i => i.Set >= 0).Select(i => i.Set).ToArray();
        var oldScore = old.Sum(k => sets[k].Verdict.Score);
        var pool = new CandidatePool(recipe, sub.Select(i => usable[i]).ToList(), _limits, withPairs: true);
        if (pool.Usable.Count != sub.Length || new ExactPacker(recipe, pool, rule, _limits).Solve() is not { } found)
        {
            return false;
        }

        var better =
            found.Count > old.Length
            || (found.Count == old.Length && found.Sum(f => f.Verdict.Score) < oldScore - 1e-6);
        if (!better)
        {
            return false;
        }

        foreach (var k in old.OrderDescending())
        {
            sets.RemoveAt(k);
        }

        foreach (var (fills, verdict) in found)
        {
            sets.Add((fills.Select(o => o with { A = sub[o.A], B = o.B >= 0 ? sub[o.B] : -1 }).ToArray(), verdict));
        }

        return true;
    }

    private List<Item> Items(List<(Option[] Fills, SetVerdict Verdict)> sets)
    {
        var used = new bool[usable.Count];
        var items = new List<Item>();
        for (var k = 0; k < sets.Count; k++)
        {
            var parts = sets[k].Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray();
            foreach (var p in parts)
            {
                used[p] = true;
            }

            items.Add(new Item(parts.Average(p => _z[p]), k, parts));
        }

        for (var i = 0; i < usable.Count; i++)
        {
            if (!used[i])
            {
                items.Add(new Item(_z[i], -1, [i]));
            }
        }

        items.Sort((a, b) => a.Key.CompareTo(b.Key));
        return items;
    }

    private sealed record Item(double Key, int Set, int[] Parts);
}
