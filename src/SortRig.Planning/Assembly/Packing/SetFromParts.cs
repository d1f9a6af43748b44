using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.Packing;

/// <summary>Turns a set given only as its parts back into fills: which part (or pair) fills which position.</summary>
internal static class SetFromParts
{
    /// <summary>The best-scoring assignment of exactly these parts to the positions that meets every spec in the
    /// worst case (every assignment, pairs included, judged by the set rule), or null; at most 16 parts.</summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="usable">The usable parts.</param>
    /// <param name="rule">The set rule.</param>
    /// <param name="options">Limits (nominal matching, assignment limit).</param>
    /// <param name="parts">Indices into <paramref name="usable"/>.</param>
    public static (Option[] Fills, SetVerdict Verdict)? Assign(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options,
        int[] parts
    )
    {
        if (parts.Length > 16)
        {
            return null;
        }

        var pool = new CandidatePool(recipe, parts.Select(i => usable[i]).ToList(), options, withPairs: true);
        if (pool.Unusable.Count > 0)
        {
            return null;
        }

        var all = (1UL << parts.Length) - 1;
        var enumerator = new FeasibleSets(recipe, pool, rule, options);
        enumerator.Enumerate();
        (ulong Mask, double Score, Option[] Fills, SetVerdict Verdict)? best = null;
        foreach (var s in enumerator.Sets)
        {
            if (s.Mask == all && (best is null || s.Score < best.Value.Score))
            {
                best = s;
            }
        }

        if (best is not { } b)
        {
            return null;
        }

        var fills = b.Fills.Select(o => o with { A = parts[o.A], B = o.B >= 0 ? parts[o.B] : -1 }).ToArray();
        return (fills, b.Verdict);
    }
}
