namespace SortRig.Tests.Support;

/// <summary>
/// Independent brute force for matched sets of one nominal n: a set is good when
/// max((x + U)/n) / min((x − U)/n) − 1 ≤ tolerance (the matched-form rule as docs/planning.md states it, U the expanded
/// transfer uncertainty). Counts the most disjoint good sets by trying every subset and every packing.
/// </summary>
internal static class MatchedBruteForce
{
    public static double WorstPpm(IEnumerable<(double Value, double U)> parts, double nominal)
    {
        var list = parts.ToList();
        return ((list.Max(p => (p.Value + p.U) / nominal) / list.Min(p => (p.Value - p.U) / nominal)) - 1) * 1e6;
    }

    /// <summary>All good sets of <paramref name="size"/> parts, as bit masks; throws when one lies within 1 ppm of the
    /// tolerance, so that rounding cannot decide a test.</summary>
    public static List<int> GoodSets(
        IReadOnlyList<(double Value, double U)> parts,
        int size,
        double nominal,
        double tolerancePpm
    )
    {
        var good = new List<int>();
        for (var mask = 0; mask < 1 << parts.Count; mask++)
        {
            if (System.Numerics.BitOperations.PopCount((uint)mask) != size)
            {
                continue;
            }

            var worst = WorstPpm(
                Enumerable.Range(0, parts.Count).Where(i => (mask & (1 << i)) != 0).Select(i => parts[i]),
                nominal
            );
            if (Math.Abs(worst - tolerancePpm) < 1)
            {
                throw new InvalidOperationException(
                    $"set {mask:X} lies on the tolerance ({worst} ppm): choose other test values"
                );
            }

            if (worst <= tolerancePpm)
            {
                good.Add(mask);
            }
        }

        return good;
    }

    /// <summary>Most disjoint good sets (memoised over the used-part mask; branch on the lowest free part).</summary>
    public static int MaxDisjoint(
        IReadOnlyList<(double Value, double U)> parts,
        int size,
        double nominal,
        double tolerancePpm
    )
    {
        var good = GoodSets(parts, size, nominal, tolerancePpm);
        var full = (1 << parts.Count) - 1;
        var memo = new Dictionary<int, int>();
        int Best(int used)
        {
            if (used == full)
            {
                return 0;
            }

            if (memo.TryGetValue(used, out var known))
            {
                return known;
            }

            var low = System.Numerics.BitOperations.TrailingZeroCount(~used);
            var best = Best(used | (1 << low));
            foreach (var set in good)
            {
                if ((set & used) == 0 && (set & (1 << low)) != 0)
                {
                    best = Math.Max(best, 1 + Best(used | set));
                }
            }

            memo[used] = best;
            return best;
        }

        return Best(0);
    }
}
