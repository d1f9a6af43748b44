namespace SortRig.Planning.Assembly;

/// <summary>
/// Swap/repair move for recipes whose sets are too large for the neighbourhood window (the 16-position R-2R ladder).
/// Around a centre c (each leftover part's deviation z = ln(value / nominal) in turn) a new set is drafted from the
/// leftover part of each position's nominal nearest to c. When the draft fails, its members farthest from c are
/// exchanged, worst first, for a part nearer to c that sits in an existing set, provided that set still meets every
/// spec with a leftover part in its place (single-part swap between a set and the leftovers). The draft is added as
/// soon as it meets every spec; otherwise every swap is undone. Every set is judged by the real worst-case rule, so
/// the plan stays valid and the number of sets never falls. Deterministic; stops at the time limit.
/// </summary>
internal sealed class RepairSearch(
    IReadOnlyList<PartCandidate> usable,
    ISetRule rule,
    SweepGeometry geo,
    AssemblyOptions options
)
{
    private const int Donors = 24;
    private const int Rounds = 4;
    private const int Fillers = 6;
    private readonly double[] _z = usable.Select(p => Math.Log(p.Value.Value / p.Nominal)).ToArray();

    public int Added { get; private set; }

    public List<(Option[] Fills, SetVerdict Verdict)> Improve(
        List<(Option[] Fills, SetVerdict Verdict)> start,
        int bound,
        Func<bool> outOfTime,
        CancellationToken cancellationToken
    )
    {
        var sets = new List<(Option[] Fills, SetVerdict Verdict)>(start);
        var owner = Enumerable.Repeat(-1, usable.Count).ToArray();
        for (var s = 0; s < sets.Count; s++)
        {
            foreach (var f in sets[s].Fills)
            {
                owner[f.A] = s;
                if (f.B >= 0)
                {
                    owner[f.B] = s;
                }
            }
        }

        var progress = true;
        while (progress && sets.Count < bound)
        {
            progress = false;
            var centres = Enumerable
                .Range(0, usable.Count)
                .Where(i => owner[i] < 0)
                .OrderBy(i => _z[i])
                .ThenBy(i => i)
                .ToList();
            foreach (var centre in centres)
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (outOfTime() || sets.Count >= bound)
                {
                    return sets;
                }

                if (owner[centre] < 0 && TryBuild(sets, owner, _z[centre]))
                {
                    Added++;
                    progress = true;
                }
            }
        }

        return sets;
    }

    private bool TryBuild(List<(Option[] Fills, SetVerdict Verdict)> sets, int[] owner, double c)
    {
        var n = geo.ClassOf.Length;
        var draft = new int[n];
        var taken = new HashSet<int>();
        for (var k = 0; k < n; k++)
        {
            var best = Nearest(k, c, i => owner[i] < 0 && !taken.Contains(i));
            if (best < 0)
            {
                return false;
            }

            draft[k] = best;
            taken.Add(best);
        }

        var undo = new List<(int Set, (Option[] Fills, SetVerdict Verdict) Old)>();
        var verdict = Judge(draft);
        // Rounds over the positions, farthest member first, while a swap still happens.
        for (var round = 0; round < Rounds && !verdict.Meets; round++)
        {
            var swapped = false;
            foreach (var k in Enumerable.Range(0, n).OrderByDescending(k => Math.Abs(_z[draft[k]] - c)).ThenBy(k => k))
            {
                if (verdict.Meets)
                {
                    break;
                }

                if (Swap(sets, owner, draft, taken, undo, k, c))
                {
                    swapped = true;
                    verdict = Judge(draft);
                }
            }

            if (!swapped)
            {
                break;
            }
        }

        if (verdict.Meets)
        {
            var index = sets.Count;
            sets.Add((draft.Select(i => Option.Single(i, usable[i])).ToArray(), verdict));
            foreach (var i in draft)
            {
                owner[i] = index;
            }

            return true;
        }

        for (var u = undo.Count - 1; u >= 0; u--)
        {
            var (s, old) = undo[u];
            foreach (var f in sets[s].Fills)
            {
                owner[f.A] = -1;
                if (f.B >= 0)
                {
                    owner[f.B] = -1;
                }
            }

            sets[s] = old;
            foreach (var f in old.Fills)
            {
                owner[f.A] = s;
                if (f.B >= 0)
                {
                    owner[f.B] = s;
                }
            }
        }

        return false;
    }

    // Moves into draft[k] a part nearer to c taken from a set that still meets every spec with a leftover in its place.
    private bool Swap(
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        int[] owner,
        int[] draft,
        HashSet<int> taken,
        List<(int Set, (Option[] Fills, SetVerdict Verdict) Old)> undo,
        int k,
        double c
    )
    {
        var gap = Math.Abs(_z[draft[k]] - c);
        var donors = Enumerable
            .Range(0, usable.Count)
            .Where(i =>
                owner[i] >= 0
                && !taken.Contains(i)
                && Fits(k, i)
                && Math.Abs(_z[i] - c) < gap
                && IsSingle(sets[owner[i]].Fills, i)
            )
            .OrderBy(i => Math.Abs(_z[i] - c))
            .ThenBy(i => i)
            .Take(Donors)
            .ToList();
        foreach (var q in donors)
        {
            var s = owner[q];
            var slot = Array.FindIndex(sets[s].Fills, f => f.A == q && f.B < 0);
            var fillers = Enumerable
                .Range(0, usable.Count)
                .Where(r => owner[r] < 0 && !taken.Contains(r) && Fits(slot, r))
                .OrderBy(r => Math.Abs(_z[r] - _z[q]))
                .ThenBy(r => r)
                .Take(Fillers)
                .ToList();
            foreach (var r in fillers)
            {
                var fills = (Option[])sets[s].Fills.Clone();
                fills[slot] = Option.Single(r, usable[r]);
                var changed = rule.Judge(fills);
                if (!changed.Meets)
                {
                    continue;
                }

                undo.Add((s, sets[s]));
                sets[s] = (fills, changed);
                (owner[q], owner[r]) = (-1, s);
                taken.Remove(draft[k]);
                draft[k] = q;
                taken.Add(q);
                return true;
            }
        }

        return false;
    }

    private SetVerdict Judge(int[] draft) => rule.Judge(draft.Select(i => Option.Single(i, usable[i])).ToArray());

    private bool Fits(int position, int part) =>
        options.SameNominal(usable[part].Nominal, geo.Nominals[geo.ClassOf[position]]);

    private static bool IsSingle(Option[] fills, int part) => fills.Any(f => f.A == part && f.B < 0);

    private int Nearest(int position, double c, Func<int, bool> free)
    {
        var best = -1;
        for (var i = 0; i < usable.Count; i++)
        {
            if (free(i) && Fits(position, i) && (best < 0 || Math.Abs(_z[i] - c) < Math.Abs(_z[best] - c)))
            {
                best = i;
            }
        }

        return best;
    }
}
