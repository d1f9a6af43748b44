using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// The window sweep run again on each side of the widest empty stretch of deviation z = ln(value / nominal) among the
/// usable parts, the two plans joined. Feasible sets are local in z (every output is unchanged when all parts move
/// together), but the sweep's pairing pairs the reel's extremes with each other: on a reel with a hole at the centre
/// (stock with the tighter grade sorted out) it spends one mode's parts on pairs for the other. Run on each mode
/// alone it cannot. The caller keeps the joined plan only when it has more sets; every set is judged by the real rule
/// (the sweep verifies each), and the two sides share no part.
/// </summary>
internal static class GapSplitSweep
{
    /// <summary>The joined plan (indices into <paramref name="pool"/>'s usable parts) and the gap's edges in z, or
    /// null when there are fewer than two parts.</summary>
    public static (List<(Option[] Fills, SetVerdict Verdict)> Sets, double Low, double High)? Run(
        Recipe recipe,
        CandidatePool pool,
        ISetRule rule,
        AssemblyOptions options
    )
    {
        var usable = pool.Usable;
        if (usable.Count < 2)
        {
            return null;
        }

        var order = Enumerable.Range(0, usable.Count).OrderBy(i => Z(usable[i])).ToArray();
        var cut = 1;
        for (var k = 2; k < order.Length; k++)
        {
            if (Z(usable[order[k]]) - Z(usable[order[k - 1]]) > Z(usable[order[cut]]) - Z(usable[order[cut - 1]]))
            {
                cut = k;
            }
        }

        var sets = new List<(Option[] Fills, SetVerdict Verdict)>();
        foreach (var side in new[] { order[..cut], order[cut..] })
        {
            var sub = new CandidatePool(recipe, side.Select(i => usable[i]).ToList(), options, withPairs: false);
            foreach (var (fills, verdict) in new SweepPlanner(recipe, sub, rule, options).Run())
            {
                sets.Add(
                    (fills.Select(o => o with { A = side[o.A], B = o.B >= 0 ? side[o.B] : -1 }).ToArray(), verdict)
                );
            }
        }

        return (sets, Z(usable[order[cut - 1]]), Z(usable[order[cut]]));
    }

    private static double Z(PartCandidate p) => Math.Log(p.Value.Value / p.Nominal);
}
