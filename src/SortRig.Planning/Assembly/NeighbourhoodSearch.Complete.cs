using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>The neighbourhood search's set completion: a new set around leftover parts, its missing singles brought in
/// along chains of sets.</summary>
internal sealed partial class NeighbourhoodSearch
{
    /// <summary>Sets made by <see cref="CompleteSets"/>.</summary>
    public int Completed { get; private set; }

    // Matched form: leftover singles that fit one window are the core of a new set; each position still empty is
    // filled by a chain, as in an augmenting path (textbook): a part of its nominal taken from a nearby set, whose
    // slot takes another part (each set judged by the real rule with its new part), back to a leftover. Each set
    // changes in one slot at most; the new set is judged by the real rule before anything is kept. Returns sets added.
    internal int CompleteSets(List<(Option[] Fills, SetVerdict Verdict)> sets, CancellationToken cancellationToken)
    {
        if (rule is not MatchedRule matched || recipe.Positions.Count < 2)
        {
            return 0;
        }

        var added = 0;
        for (var progress = true; progress; )
        {
            progress = false;
            var used = new bool[usable.Count];
            foreach (var (fills, _) in sets)
            {
                foreach (var f in fills)
                {
                    used[f.A] = true;
                    if (f.B >= 0)
                    {
                        used[f.B] = true;
                    }
                }
            }

            var leftovers = Enumerable.Range(0, usable.Count).Where(i => !used[i]).ToList();
            foreach (var u in leftovers)
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (TryComplete(sets, matched, leftovers, u) is not { } done)
                {
                    continue;
                }

                foreach (var (k, fills) in done.Changed)
                {
                    sets[k] = (fills, rule.Judge(fills));
                }

                sets.Add((done.Fills, done.Verdict));
                added++;
                progress = true;
                break;
            }
        }

        Completed += added;
        return added;
    }

    private (Dictionary<int, Option[]> Changed, Option[] Fills, SetVerdict Verdict)? TryComplete(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        MatchedRule matched,
        List<int> leftovers,
        int u
    )
    {
        var n = recipe.Positions.Count;
        var core = Enumerable.Repeat(-1, n).ToArray();
        var taken = new HashSet<int>();
        for (var p = 0; p < n; p++)
        {
            foreach (
                var l in leftovers.Where(l => !taken.Contains(l) && Fits(p, l)).OrderBy(l => Math.Abs(_z[l] - _z[u]))
            )
            {
                if (Spread(matched, core, p, l) <= matched.Window)
                {
                    core[p] = l;
                    taken.Add(l);
                }

                break;
            }
        }

        if (core.Count(c => c >= 0) < 2 || !core.Contains(u))
        {
            return null;
        }

        var changed = new Dictionary<int, Option[]>();
        for (var r = 0; r < n; r++)
        {
            if (core[r] >= 0)
            {
                continue;
            }

            if (Chain(sets, matched, changed, taken, leftovers, core, r) is not { } arrived)
            {
                return null;
            }

            core[r] = arrived;
        }

        var fills = core.Select(a => Option.Single(a, usable[a])).ToArray();
        var verdict = rule.Judge(fills);
        return verdict.Meets ? (changed, fills, verdict) : null;
    }

    // Worst-case spread in log units of the core's singles with part l at position p.
    private double Spread(MatchedRule matched, int[] core, int p, int l)
    {
        var (lo, hi) = (matched.Lo(p, Option.Single(l, usable[l])), matched.Hi(p, Option.Single(l, usable[l])));
        for (var k = 0; k < core.Length; k++)
        {
            if (core[k] >= 0 && k != p)
            {
                var o = Option.Single(core[k], usable[core[k]]);
                (lo, hi) = (Math.Min(lo, matched.Lo(k, o)), Math.Max(hi, matched.Hi(k, o)));
            }
        }

        return hi - lo;
    }

    // Breadth first from the leftovers of position r's nominal: a part fits the core at r (it arrives), or enters a
    // set not yet changed in a slot of its nominal held by a single, which moves on. Records the changed sets.
    private int? Chain(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        MatchedRule matched,
        Dictionary<int, Option[]> changed,
        HashSet<int> taken,
        List<int> leftovers,
        int[] core,
        int r
    )
    {
        var reach = 4 * matched.Window;
        var centre = core.Where(c => c >= 0).Average(c => _z[c]);
        var from = new Dictionary<int, (int Set, int Slot, int Prev)>();
        var queue = new Queue<int>();
        foreach (var l in leftovers.Where(l => !taken.Contains(l) && Fits(r, l)))
        {
            from[l] = (-1, -1, -1);
            queue.Enqueue(l);
        }

        var entered = new HashSet<int>(changed.Keys);
        while (queue.Count > 0)
        {
            var part = queue.Dequeue();
            if (Spread(matched, core, r, part) <= matched.Window)
            {
                // Arrived: walk back, each set on the path taking the part that displaced its single.
                var x = part;
                while (from[x] is { Set: >= 0 } step)
                {
                    var fills = (Option[])sets[step.Set].Fills.Clone();
                    fills[step.Slot] = Option.Single(step.Prev, usable[step.Prev]);
                    changed[step.Set] = fills;
                    x = step.Prev;
                }

                taken.Add(x);
                taken.Add(part);
                return part;
            }

            for (var k = 0; k < sets.Count; k++)
            {
                var fills = sets[k].Fills;
                if (entered.Contains(k) || Math.Abs(fills.Average(f => _z[f.A]) - _z[part]) > reach)
                {
                    continue;
                }

                for (var p = 0; p < fills.Length; p++)
                {
                    var old = fills[p];
                    if (old.B >= 0 || !Fits(p, part) || from.ContainsKey(old.A) || Math.Abs(_z[old.A] - centre) > reach)
                    {
                        continue;
                    }

                    var trial = (Option[])fills.Clone();
                    trial[p] = Option.Single(part, usable[part]);
                    if (!rule.Judge(trial).Meets)
                    {
                        continue;
                    }

                    entered.Add(k);
                    from[old.A] = (k, p, part);
                    queue.Enqueue(old.A);
                    break;
                }
            }
        }

        return null;
    }
}
