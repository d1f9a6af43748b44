using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Network form: a bound that sees how parts crowd together. Take two nominal classes A and B and m = the smaller of
/// their numbers of single-only positions (positions without pair builds). In every feasible set, pair the part at the
/// i-th A position with the part at the i-th B position: m disjoint (A part, B part) pairs, and the B part's value lies
/// in the partner box of the A part (<see cref="NetworkPartFilter.Box"/>, the hull over those positions), a proven
/// relaxation. So N sets give a matching of size m·N in the graph "B part within the A part's partner interval", and
/// sets ≤ ⌊M / m⌋ with M the maximum matching. The graph is convex (each A part's neighbours are an interval of the
/// B parts sorted by value), so M is found exactly by Glover's greedy: B parts in increasing value, each matched to the
/// open A part whose interval ends first (textbook: Glover 1967, convex bipartite matching).
/// A part whose box is not computed within the time budget gets every B part as a neighbour, which only raises M.
/// </summary>
internal static class PartnerMatchingBound
{
    /// <summary>The bound, int.MaxValue when no class pair applies.</summary>
    public static int Compute(
        Recipe recipe, NetworkPartFilter filter, SweepGeometry geo, IReadOnlyList<PartCandidate> usable, AssemblyOptions options, Func<bool> stop)
    {
        var bound = int.MaxValue;
        var classes = geo.Nominals.Length;
        for (var a = 0; a < classes; a++)
        {
            for (var b = 0; b < classes; b++)
            {
                if (a == b)
                {
                    continue;
                }

                var aPositions = Positions(recipe, geo, filter, a);
                var bPositions = Positions(recipe, geo, filter, b);
                var m = Math.Min(aPositions.Length, bPositions.Length);
                if (m == 0)
                {
                    continue;
                }

                var matching = Matching(filter, usable, options, geo.Nominals[a], geo.Nominals[b], aPositions, bPositions, stop);
                bound = Math.Min(bound, matching / m);
            }
        }

        return bound;
    }

    private static int[] Positions(Recipe recipe, SweepGeometry geo, NetworkPartFilter filter, int cls) =>
        Enumerable.Range(0, recipe.Positions.Count).Where(k => geo.ClassOf[k] == cls && filter.SingleOnly(k)).ToArray();

    private static int Matching(
        NetworkPartFilter filter, IReadOnlyList<PartCandidate> usable, AssemblyOptions options, double nominalA, double nominalB,
        int[] aPositions, int[] bPositions, Func<bool> stop)
    {
        var left = new List<(double Lo, double Hi)>();
        for (var i = 0; i < usable.Count; i++)
        {
            if (!options.SameNominal(usable[i].Nominal, nominalA))
            {
                continue;
            }

            if (stop())
            {
                left.Add((double.NegativeInfinity, double.PositiveInfinity));
                continue;
            }

            var (lo, hi) = (double.PositiveInfinity, double.NegativeInfinity);
            foreach (var k in aPositions)
            {
                if (filter.Box(k, i) is { } box)
                {
                    foreach (var l in bPositions)
                    {
                        (lo, hi) = (Math.Min(lo, box.Lo[l]), Math.Max(hi, box.Hi[l]));
                    }
                }
            }

            if (lo <= hi)
            {
                // Widened by 1e-9 so rounding can only add neighbours.
                left.Add((lo * (1 - 1e-9), hi * (1 + 1e-9)));
            }
        }

        var right = usable.Where(p => options.SameNominal(p.Nominal, nominalB)).Select(p => p.Value.Value).Order().ToArray();
        return ConvexMatching(left, right);
    }

    /// <summary>Maximum matching of intervals (left) to points (right): Glover's greedy, exact for convex graphs.</summary>
    public static int ConvexMatching(IReadOnlyList<(double Lo, double Hi)> intervals, double[] sortedPoints)
    {
        var byStart = intervals.OrderBy(t => t.Lo).ToArray();
        var open = new PriorityQueue<int, double>();
        var next = 0;
        var matched = 0;
        foreach (var x in sortedPoints)
        {
            while (next < byStart.Length && byStart[next].Lo <= x)
            {
                open.Enqueue(next, byStart[next].Hi);
                next++;
            }

            while (open.TryPeek(out _, out var end) && end < x)
            {
                open.Dequeue();
            }

            if (open.TryDequeue(out _, out _))
            {
                matched++;
            }
        }

        return matched;
    }
}
