using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Large-neighbourhood search over a plan. Sets and leftover parts are ordered by their deviation z = ln(value /
/// marked nominal) (a set by its members' mean): feasible sets are local in z because every output is unchanged when
/// all parts move together. A window of neighbouring items holding at most <see
/// cref="AssemblyOptions.NeighbourhoodParts"/> parts is re-packed by the exact search (<see cref="ExactPacker"/>, every
/// feasible assignment judged by the real worst-case rule, so error cancellation counts); the window's sets are
/// replaced when the exact packing has more sets, or as many with a smaller sum of scores. Windows slide by half their
/// length; passes repeat until one changes nothing or the time runs out. Sets come first: while a window's parts cannot
/// make more sets than it holds (<see cref="PartCountBound"/> over the window's parts, filters included), it is not
/// re-packed; re-packs for a smaller sum of scores run only once no window can gain a set, and after each such pass
/// the count-first passes run again. Deterministic.
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
        exactSetLimit: 50_000,
        exactStateLimit: 400_000,
        nominalMatchPpm: options.NominalMatchPpm,
        neighbourhoodParts: 0
    );
    private readonly double[] _z = usable.Select(p => Math.Log(p.Value.Value / p.Nominal)).ToArray();

    public int Passes { get; private set; }

    public int Replaced { get; private set; }

    /// <summary>Re-packs that exceeded the exact search's limits and were tried again on fewer parts.</summary>
    public int Shrunk { get; private set; }

    /// <summary>Windows left alone because their parts cannot make more sets than they hold.</summary>
    public int Skipped { get; private set; }

    // True while only re-packs that gain a set are sought (windows whose part-count bound shows no gain are skipped).
    private bool _countFirst = true;

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

        var (releasedAt, idleReleases) = (sets.Count, 0);
        while (true)
        {
            _countFirst = true;
            Passes = Sweeps(sets, bound, outOfTime, passDone, cancellationToken);
            if (sets.Count < bound && !outOfTime())
            {
                Scatter(sets, bound, outOfTime, cancellationToken);
                passDone(++Passes, sets.Count);
            }

            if (sets.Count >= bound || outOfTime())
            {
                return sets;
            }

            // Leftover singles take the place of pairs (same sets, parts given back): count first again. The score
            // pass below may form those pairs again (a smaller sum of scores), so a release that gained no set is
            // tried at most twice in a row: the search still ends on its own.
            if (sets.Count > releasedAt)
            {
                (releasedAt, idleReleases) = (sets.Count, 0);
            }

            if (CompleteSets(sets, cancellationToken) > 0)
            {
                continue;
            }

            if (idleReleases < MaxIdleReleases && ReleasePairs(sets, cancellationToken) > 0)
            {
                idleReleases++;
                continue;
            }

            // No window gains a set: one pass for a smaller sum of scores (it moves parts between sets and leftovers,
            // which may open a gain), then count first again.
            _countFirst = false;
            var before = Replaced;
            Passes = Sweeps(sets, bound, outOfTime, passDone, cancellationToken, onePass: true);
            if (Replaced == before || outOfTime())
            {
                return sets;
            }
        }
    }

    // Passes of sliding windows until one changes nothing (or only one when onePass); returns the pass count so far.
    private int Sweeps(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        int bound,
        Func<bool> outOfTime,
        Action<int, int> passDone,
        CancellationToken cancellationToken,
        bool onePass = false
    )
    {
        var pass = Passes + 1;
        for (; sets.Count < bound || pass == Passes + 1; pass++)
        {
            var changed = false;
            var items = Items(sets);
            for (var s = 0; s < items.Count; )
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (outOfTime())
                {
                    passDone(pass, sets.Count);
                    return pass;
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

            passDone(pass, sets.Count);
            if (!changed || onePass)
            {
                return pass;
            }
        }

        return pass - 1;
    }

    private bool TryRepack(List<(Option[] Fills, SetVerdict Verdict)> sets, List<Item> window)
    {
        var sub = window.SelectMany(i => i.Parts).ToArray();
        var old = window.Where(i => i.Set >= 0).Select(i => i.Set).ToArray();
        var oldScore = old.Sum(k => sets[k].Verdict.Score);
        var parts = sub.Select(i => usable[i]).ToList();
        // The window's own part-count bound (a proven bound on what its parts can make): no gain, no re-pack.
        if (_countFirst && PartCountBound.Compute(recipe, parts, rule, _limits) <= old.Length)
        {
            Skipped++;
            return false;
        }

        var pool = new CandidatePool(recipe, parts, _limits, withPairs: true);
        if (pool.Usable.Count != sub.Length)
        {
            return false;
        }

        if (new ExactPacker(recipe, pool, rule, _limits).Solve() is not { } found)
        {
            // Too many assignments (many pairs among parts that all fit one window): try again with the leftovers
            // and the items nearest to them, two thirds of the parts, while that still holds two sets.
            Shrunk++;
            return Smaller(window, sub.Length) is { } smaller && TryRepack(sets, smaller);
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

    private List<Item>? Smaller(List<Item> window, int parts)
    {
        var limit = parts * 2 / 3;
        if (limit < 2 * recipe.Positions.Count)
        {
            return null;
        }

        var leftovers = window.Where(i => i.Set < 0).ToList();
        if (leftovers.Count == 0)
        {
            return null;
        }

        var centre = leftovers.Average(i => i.Key);
        var kept = new List<Item>();
        var count = 0;
        foreach (var item in leftovers.Concat(window.Where(i => i.Set >= 0).OrderBy(i => Math.Abs(i.Key - centre))))
        {
            if (count + item.Parts.Length <= limit)
            {
                kept.Add(item);
                count += item.Parts.Length;
            }
        }

        return kept.Count(i => i.Set < 0) == leftovers.Count && kept.Count < window.Count ? kept : null;
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
