using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.Packing;

/// <summary>
/// More sets from the column LP's pool (price-and-branch in spirit: the integer programme over the generated columns).
/// First an exact cover by complementary slackness (LP duality, textbook): with duals y ≥ 0 and m = min y(S) over
/// every feasible set, any disjoint sets that use only columns with y(S) = m and cover every part with y_i &gt; 0
/// number Σ y / m, the LP value itself, so they are optimal whenever the LP is integral; <see cref="ExactCover"/> looks
/// for one among the pool's columns. When there is none (or time runs out) the sets found so far stand: a local search
/// over the pool (iterated (1,2)-swaps) was tried and dropped, as it found fewer sets than the neighbourhood search in
/// the same time (docs/planning.md). On the 1 000-part divider reels the converged LP's own columns hold such a cover.
/// </summary>
internal static class PoolPacker
{
    /// <summary>The exact cover's sets when there is one with more sets than <paramref name="found"/>, else
    /// <paramref name="found"/>.</summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="usable">The usable parts (the pool's indices point here).</param>
    /// <param name="rule">The set rule; each new set is assigned to positions and judged again.</param>
    /// <param name="options">Limits (nominal matching).</param>
    /// <param name="lp">The column LP's result: its pool of feasible sets (part indices), duals and minimum set cost.
    /// </param>
    /// <param name="found">Disjoint sets found so far.</param>
    /// <param name="stop">True when time is up.</param>
    /// <returns>The sets, and how they were packed, in words.</returns>
    public static (List<(Option[] Fills, SetVerdict Verdict)> Sets, string How) Improve(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options,
        ColumnBound.ColumnBoundResult lp,
        List<(Option[] Fills, SetVerdict Verdict)> found,
        Func<bool> stop
    )
    {
        var columns = new List<int[]>();
        var value = new List<double>();
        var index = new Dictionary<string, int>();
        var known = new Dictionary<int, (Option[] Fills, SetVerdict Verdict)>();
        foreach (var set in found)
        {
            var j = Add(set.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray());
            known[j] = set;
        }

        // By decreasing LP value, so that the cover search tries the LP's own columns first.
        foreach (var k in Enumerable.Range(0, lp.Pool.Count).OrderByDescending(k => lp.PoolValues[k]))
        {
            var j = Add(lp.Pool[k]);
            value[j] = Math.Max(value[j], lp.PoolValues[k]);
        }

        var y = lp.Duals;
        var tight = Enumerable
            .Range(0, columns.Count)
            .Where(j => columns[j].Sum(i => y[i]) <= lp.MinSetCost * (1 + 1e-6))
            .ToList();
        // Restarts with doubling node limits and a shuffled order of the tied options (search times of such
        // backtracking are heavy-tailed; restarts in the manner of Gomes, Selman and Kautz 1998, from memory).
        List<int>? cover = null;
        var complete = false;
        var rng = new Random(1);
        var order = tight.ToArray();
        for (var limit = 20_000L; cover is null && !complete && !stop(); limit *= 2)
        {
            var search = new ExactCover(
                usable.Count,
                i => y[i] > lp.MinSetCost * 1e-7,
                [.. order.Select(j => columns[j])]
            );
            var tried = order;
            cover = search.Solve(() => search.Nodes > limit || stop(), out complete);
            if (cover is not null)
            {
                cover = cover.Select(k => tried[k]).ToList();
            }

            order = tight.OrderByDescending(j => value[j] + (0.5 * rng.NextDouble())).ToArray();
        }

        var how = cover is null
            ? complete
                ? "no exact cover of the parts with positive duals by sets at the LP's minimum cost"
                : "the exact cover search stopped by the time limit"
            : $"exact cover from the {tight.Count} sets at the LP's minimum cost";
        if (cover is null || cover.Count <= found.Count)
        {
            return (found, how);
        }

        var sets = new List<(Option[] Fills, SetVerdict Verdict)>();
        foreach (var j in cover)
        {
            if (known.TryGetValue(j, out var set))
            {
                sets.Add(set);
            }
            else if (SetFromParts.Assign(recipe, usable, rule, options, columns[j]) is { } made)
            {
                sets.Add(made);
            }
        }

        return (sets.Count > found.Count ? sets : found, how);

        int Add(int[] parts)
        {
            var sorted = parts.Order().ToArray();
            var key = string.Join(',', sorted);
            if (!index.TryGetValue(key, out var j))
            {
                j = columns.Count;
                index[key] = j;
                columns.Add(sorted);
                value.Add(0);
            }

            return j;
        }
    }
}
