using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>The neighbourhood search's pair release: leftover singles take the place of pairs.</summary>
internal sealed partial class NeighbourhoodSearch
{
    // Releases in a row that gained no set before the search gives up on them (see Improve).
    private const int MaxIdleReleases = 2;

    /// <summary>Pairs given back by <see cref="ReleasePairs"/> (each frees two parts).</summary>
    public int Released { get; private set; }

    // A pair fills a position with two parts where one single of the position's nominal would do; every set keeps its
    // count, and the two parts it gives back may make another set. So, as in an augmenting path of bipartite matching
    // (textbook), a leftover single q takes a slot of a set k (the set judged by the real rule with q there): if the
    // slot held a pair, the pair is freed; if it held a single q', q' moves on to another set. Breadth first from the
    // leftover singles, each set entered at most once per path (so each set changes in one slot only and its
    // judgement stands). Returns the pairs freed.
    internal int ReleasePairs(List<(Option[] Fills, SetVerdict Verdict)> sets, CancellationToken cancellationToken)
    {
        var slots = Enumerable
            .Range(0, recipe.Positions.Count)
            .Where(p => recipe.Positions[p].Pairs != PairBuilds.None)
            .ToArray();
        if (slots.Length == 0 || recipe.Form != RecipeForm.Matched)
        {
            return 0;
        }

        var freed = 0;
        while (true)
        {
            cancellationToken.ThrowIfCancellationRequested();
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

            // Tails first: a part far from the centre has the fewest sets it can join.
            var starts = Enumerable
                .Range(0, usable.Count)
                .Where(i => !used[i] && slots.Any(p => Fits(p, i)))
                .OrderByDescending(i => Math.Abs(_z[i]))
                .ToList();
            var path = starts.Select(q => Augment(sets, slots, q)).FirstOrDefault(p => p is not null);
            if (path is null)
            {
                Released += freed;
                return freed;
            }

            foreach (var (k, fills, verdict) in path)
            {
                sets[k] = (fills, verdict);
            }

            freed++;
        }
    }

    private bool Fits(int position, int part) =>
        options.SameNominal(usable[part].Nominal, recipe.Positions[position].Nominal);

    // One breadth-first search from leftover single q; the sets to change (new fills and verdicts) or null.
    private List<(int Set, Option[] Fills, SetVerdict Verdict)>? Augment(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        int[] slots,
        int q
    )
    {
        // Only sets whose key (the mean z of their parts) lies within four match windows of the part: a set that can
        // take it has every single within one window of it, and a pair's two parts average to a point in that window
        // too, so the key is within about one window; four leave room for the parts' uncertainties.
        var reach = 4 * Math.Log(1 + (Math.Max(recipe.MatchTolerancePpm, 1) * 1e-6));
        var keys = sets.Select(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).Average(i => _z[i]))
            .ToArray();
        var entered = new bool[sets.Count];
        var from = new Dictionary<int, (int Set, int Slot, int Prev)>();
        var queue = new Queue<int>();
        queue.Enqueue(q);
        from[q] = (-1, -1, -1);
        while (queue.Count > 0)
        {
            var part = queue.Dequeue();
            for (var k = 0; k < sets.Count; k++)
            {
                if (entered[k] || Math.Abs(keys[k] - _z[part]) > reach)
                {
                    continue;
                }

                foreach (var p in slots)
                {
                    var old = sets[k].Fills[p];
                    if (!Fits(p, part) || (old.B < 0 && from.ContainsKey(old.A)))
                    {
                        continue;
                    }

                    var trial = (Option[])sets[k].Fills.Clone();
                    trial[p] = Option.Single(part, usable[part]);
                    var verdict = rule.Judge(trial);
                    if (!verdict.Meets)
                    {
                        continue;
                    }

                    entered[k] = true;
                    if (old.B >= 0)
                    {
                        return Path(sets, from, (k, p, part), verdict);
                    }

                    from[old.A] = (k, p, part);
                    queue.Enqueue(old.A);
                    break;
                }
            }
        }

        return null;
    }

    // Walks the path back from the set whose pair is freed to the leftover single that started it.
    private List<(int Set, Option[] Fills, SetVerdict Verdict)> Path(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        Dictionary<int, (int Set, int Slot, int Prev)> from,
        (int Set, int Slot, int Part) last,
        SetVerdict lastVerdict
    )
    {
        var result = new List<(int, Option[], SetVerdict)>();
        var (k, p, part) = last;
        var verdict = lastVerdict;
        while (true)
        {
            var fills = (Option[])sets[k].Fills.Clone();
            fills[p] = Option.Single(part, usable[part]);
            result.Add((k, fills, verdict));
            var (set, slot, prev) = from[part];
            if (set < 0)
            {
                return result;
            }

            // The part displaced from set `set` was `part`; the part that took its place there is `prev`.
            var moved = (Option[])sets[set].Fills.Clone();
            moved[slot] = Option.Single(prev, usable[prev]);
            (k, p, part, verdict) = (set, slot, prev, rule.Judge(moved));
        }
    }
}
