namespace SortRig.Planning.Cups;

/// <summary>
/// Exact choice of disjoint fixed-width windows on a grid: window j covers grid steps j .. j + span − 1 and is worth
/// <c>gain[j]</c>; at most <c>count</c> windows, none overlapping, none at a start marked not allowed. A dynamic
/// programme over the grid (best from step i with f windows left) finds the largest total gain.
/// </summary>
internal static class WindowCover
{
    /// <summary>Start indices (ascending) of the best windows and their total gain; no window worth 0.</summary>
    public static (IReadOnlyList<int> Starts, double Total) Best(
        IReadOnlyList<double> gain,
        int span,
        IReadOnlyList<bool> allowed,
        int count
    )
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(span, 1);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var g = gain.Count;
        var best = new double[g + span + 1, count + 1];
        for (var i = g - 1; i >= 0; i--)
        {
            for (var f = 1; f <= count; f++)
            {
                best[i, f] = best[i + 1, f];
                if (allowed[i] && gain[i] > 0)
                {
                    best[i, f] = Math.Max(best[i, f], gain[i] + best[i + span, f - 1]);
                }
            }
        }

        var starts = new List<int>();
        for (int i = 0, f = count; i < g && f > 0; )
        {
            if (allowed[i] && gain[i] > 0 && gain[i] + best[i + span, f - 1] >= best[i + 1, f])
            {
                starts.Add(i);
                i += span;
                f--;
            }
            else
            {
                i++;
            }
        }

        return (starts, best[0, count]);
    }
}
