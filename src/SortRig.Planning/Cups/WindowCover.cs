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

    /// <summary>
    /// As <see cref="Best"/>, but a window may also start one grid step before the previous window ends (the two
    /// overlap by exactly one step); it is then worth <c>gain[j] − shared[j]</c>, <c>shared[j]</c> being what both
    /// windows would count (what fits the one step at j). Best from step i with f windows left, and the value of a
    /// window forced at j overlapping the previous one (chain): best[i, f] = max(best[i + 1, f], gain[i] +
    /// max(best[i + span, f − 1], chain[i + span − 1, f − 1])).
    /// </summary>
    /// <returns>Start indices (ascending) and the total gain (shared parts counted once).</returns>
    public static (IReadOnlyList<int> Starts, double Total) BestOverlapping(
        IReadOnlyList<double> gain,
        IReadOnlyList<double> shared,
        int span,
        IReadOnlyList<bool> allowed,
        int count
    )
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(span, 2);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var g = gain.Count;
        var best = new double[g + span + 1, count + 1];
        var chain = new double[g + span + 1, count + 1];
        for (var i = g + span; i >= 0; i--)
        {
            for (var f = 0; f <= count; f++)
            {
                chain[i, f] = double.NegativeInfinity;
                if (i >= g || f == 0)
                {
                    continue;
                }

                best[i, f] = best[i + 1, f];
                if (allowed[i] && gain[i] > 0)
                {
                    best[i, f] = Math.Max(best[i, f], gain[i] + Next(i, f - 1));
                }

                var own = gain[i] - shared[i];
                if (allowed[i] && own > 0)
                {
                    chain[i, f] = own + Next(i, f - 1);
                }
            }
        }

        var starts = new List<int>();
        var overlap = false;
        for (int i = 0, f = count; i < g && f > 0; )
        {
            if (overlap || (allowed[i] && gain[i] > 0 && gain[i] + Next(i, f - 1) >= best[i + 1, f]))
            {
                starts.Add(i);
                f--;
                // Continue overlapping when that is the better of the two ways on (ties: no overlap).
                overlap = f > 0 && chain[i + span - 1, f] > best[i + span, f];
                i += overlap ? span - 1 : span;
            }
            else
            {
                i++;
            }
        }

        return (starts, best[0, count]);

        // The best after a window at i with f windows left: the next one clear of it, or overlapping it by a step.
        double Next(int i, int f) => Math.Max(best[i + span, f], chain[i + span - 1, f]);
    }

    /// <summary>
    /// The best windows when some must be placed: every required window r gets one start in its range
    /// [<c>Lo</c>, <c>Hi</c>] (ranges ascending; the windows keep that order), and at most <paramref name="count"/>
    /// free windows of positive gain go where they add most; no two windows overlap. A dynamic programme over the grid
    /// (best from step i with f free windows left and required windows r.. still to place). Null when no placement
    /// keeps every required window in its range without overlap.
    /// </summary>
    /// <returns>Starts of the free windows (ascending), the start of each required window (in order) and the total
    /// gain.</returns>
    public static (IReadOnlyList<int> Free, IReadOnlyList<int> Required, double Total)? BestAround(
        IReadOnlyList<double> gain,
        int span,
        int count,
        IReadOnlyList<(int Lo, int Hi)> required
    )
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(span, 1);
        ArgumentOutOfRangeException.ThrowIfNegative(count);
        var (g, h) = (gain.Count, required.Count);
        var size = g + span + 1;
        var best = new double[size * (count + 1) * (h + 1)];
        int At(int i, int f, int r) => (((i * (count + 1)) + f) * (h + 1)) + r;
        for (var i = size - 1; i >= 0; i--)
        {
            for (var f = 0; f <= count; f++)
            {
                for (var r = 0; r <= h; r++)
                {
                    best[At(i, f, r)] = i >= g ? (r == h ? 0 : double.NegativeInfinity) : Step(i, f, r).Value;
                }
            }
        }

        if (double.IsNegativeInfinity(best[At(0, count, 0)]))
        {
            return null;
        }

        var (free, fixedStarts) = (new List<int>(), new List<int>());
        for (int i = 0, f = count, r = 0; i < g; )
        {
            var (value, choice) = Step(i, f, r);
            if (double.IsNegativeInfinity(value))
            {
                break;
            }

            if (choice == 1)
            {
                free.Add(i);
                (i, f) = (i + span, f - 1);
            }
            else if (choice == 2)
            {
                fixedStarts.Add(i);
                (i, r) = (i + span, r + 1);
            }
            else
            {
                i++;
            }
        }

        return (free, fixedStarts, best[At(0, count, 0)]);

        // The best from step i (and which move: 0 skip, 1 a free window, 2 the next required window).
        (double Value, int Choice) Step(int i, int f, int r)
        {
            if (r < h && i > required[r].Hi)
            {
                return (double.NegativeInfinity, 0);
            }

            (double, int) result = (best[At(i + 1, f, r)], 0);
            if (r < h && i >= required[r].Lo)
            {
                var v = Math.Max(0, gain[i]) + best[At(i + span, f, r + 1)];
                if (v > result.Item1)
                {
                    result = (v, 2);
                }
            }

            if (f > 0 && gain[i] > 0)
            {
                var v = gain[i] + best[At(i + span, f - 1, r)];
                if (v > result.Item1)
                {
                    result = (v, 1);
                }
            }

            return result;
        }
    }
}
