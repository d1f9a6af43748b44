namespace SortRig.Planning.Assembly;

/// <summary>An interval on the common deviation axis; Kind 0 single, 1 series pair, 2 parallel pair.</summary>
internal readonly record struct SweepItem(int Class, double Left, double Right, Option Option, int Kind);

/// <summary>
/// Greedy sweep for the one-dimensional packing problem: each set takes Demand[j] items of class j whose intervals
/// share a common point. The sweep moves the common point c up through the left ends and, at the first c where every
/// class has enough live items containing c, takes the lowest ones. When each class's intervals are proper (sorted
/// by left end = sorted by right end, e.g. equal widths) this is optimal; see docs/planning.md for the argument.
/// </summary>
internal static class IntervalSweep
{
    /// <param name="items">All items.</param>
    /// <param name="demand">Items per set of each class.</param>
    /// <param name="pairCaps">Per class: positions allowing series only, parallel only, both.</param>
    public static List<List<SweepItem>> Run(IReadOnlyList<SweepItem> items, int[] demand, int[,] pairCaps)
    {
        var classes = demand.Length;
        var byClass = Enumerable
            .Range(0, classes)
            .Select(j => items.Where(i => i.Class == j).OrderBy(i => i.Left).ThenBy(i => i.Right).ToArray())
            .ToArray();
        var used = byClass.Select(c => new bool[c.Length]).ToArray();
        var ptr = new int[classes];
        var events = items.Select(i => i.Left).Order().ToArray();
        var sets = new List<List<SweepItem>>();
        var picks = Enumerable.Range(0, classes).Select(_ => new List<int>()).ToArray();
        foreach (var c in events)
        {
            while (TryPick(c))
            {
                var set = new List<SweepItem>();
                for (var j = 0; j < classes; j++)
                {
                    foreach (var k in picks[j])
                    {
                        used[j][k] = true;
                        set.Add(byClass[j][k]);
                    }
                }

                sets.Add(set);
            }
        }

        return sets;

        bool TryPick(double c)
        {
            for (var j = 0; j < classes; j++)
            {
                var list = byClass[j];
                while (ptr[j] < list.Length && (used[j][ptr[j]] || list[ptr[j]].Right < c))
                {
                    ptr[j]++;
                }

                picks[j].Clear();
                int series = 0,
                    parallel = 0;
                for (var k = ptr[j]; k < list.Length && list[k].Left <= c && picks[j].Count < demand[j]; k++)
                {
                    var it = list[k];
                    if (used[j][k] || it.Right < c || !Allowed(j, it.Kind, series, parallel))
                    {
                        continue;
                    }

                    series += it.Kind == 1 ? 1 : 0;
                    parallel += it.Kind == 2 ? 1 : 0;
                    picks[j].Add(k);
                }

                if (picks[j].Count < demand[j])
                {
                    return false;
                }
            }

            return true;
        }

        bool Allowed(int j, int kind, int series, int parallel)
        {
            series += kind == 1 ? 1 : 0;
            parallel += kind == 2 ? 1 : 0;
            var (s, p, b) = (pairCaps[j, 0], pairCaps[j, 1], pairCaps[j, 2]);
            return series <= s + b && parallel <= p + b && series + parallel <= s + p + b;
        }
    }

    /// <summary>True when every class's intervals, sorted by left end, also have non-decreasing right ends.</summary>
    public static bool AllProper(IReadOnlyList<SweepItem> items, int classes) =>
        Enumerable
            .Range(0, classes)
            .All(j =>
            {
                var rights = items
                    .Where(i => i.Class == j)
                    .OrderBy(i => i.Left)
                    .ThenBy(i => i.Right)
                    .Select(i => i.Right)
                    .ToArray();
                return rights.Zip(rights.Skip(1)).All(t => t.First <= t.Second + 1e-12);
            });
}
