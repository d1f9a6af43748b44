using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Engine.Building;

/// <summary>
/// Lower bounds on the parts a build still needs, from counts alone (pure). The recipe's positions fall in classes by
/// nominal; class j needs N·D_j fills for N sets. A part of nominal n gives one fill to class j = n as a single, or
/// half a fill to a class it may pair for (series: n = j/2, parallel: n = 2j). Parts are given out as singles first (a
/// single fill never costs more parts than a half), then the leftovers as halves by a small maximum flow; what stays
/// short, in fills, is a lower bound on the parts still needed, since a new part gives at most one fill.
/// </summary>
internal static class BuildCounts
{
    /// <summary>Counts for a target of <paramref name="sets"/> sets from parts of the given nominals.</summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="sets">Sets wanted (≥ 1).</param>
    /// <param name="partNominals">Marked nominal of each usable part on hand, ohms.</param>
    /// <param name="options">Nominal match window.</param>
    public static BuildCount Count(Recipe recipe, int sets, IReadOnlyList<double> partNominals, AssemblyOptions options)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(sets, 1);
        var classes = recipe.Positions.Select(p => p.Nominal).Distinct().Order().ToArray();
        var demand = classes.Select(c => recipe.Positions.Count(p => p.Nominal == c)).ToArray();
        var series = classes
            .Select(c => recipe.Positions.Any(p => p.Nominal == c && p.Pairs.HasFlag(PairBuilds.Series)))
            .ToArray();
        var parallel = classes
            .Select(c => recipe.Positions.Any(p => p.Nominal == c && p.Pairs.HasFlag(PairBuilds.Parallel)))
            .ToArray();

        // Parts grouped by what they can do: (single class or -1, bit mask of classes they may be half a pair for).
        var groups = new Dictionary<(int Single, int Halves), int>();
        foreach (var n in partNominals)
        {
            var single = Array.FindIndex(classes, c => options.SameNominal(n, c));
            var halves = 0;
            for (var j = 0; j < classes.Length; j++)
            {
                halves |=
                    (series[j] && options.SameNominal(n, classes[j] / 2))
                    || (parallel[j] && options.SameNominal(n, classes[j] * 2))
                        ? 1 << j
                        : 0;
            }

            groups[(single, halves)] = groups.GetValueOrDefault((single, halves)) + 1;
        }

        var (shortFills, onHand) = Short(sets, demand, groups);
        var needs = classes
            .Select((c, j) => new NominalNeed(c, sets * demand[j], onHand[j], (int)Math.Ceiling(shortFills[j] - 1e-9)))
            .ToList();
        var more = (int)Math.Ceiling(shortFills.Sum() - 1e-9);
        var bound = 0;
        while (bound < partNominals.Count && Short(bound + 1, demand, groups).Short.Sum() < 1e-9)
        {
            bound++;
        }

        return new BuildCount(bound, more, needs);
    }

    // Fills short per class for `sets` sets, and the fills the parts give each class, singles first then halves.
    private static (double[] Short, double[] Given) Short(
        int sets,
        int[] demand,
        Dictionary<(int Single, int Halves), int> groups
    )
    {
        var k = demand.Length;
        var left = demand.Select(d => (double)(sets * d)).ToArray();
        var given = new double[k];
        var spare = new List<(int Halves, int Count)>();
        foreach (var ((single, halves), count) in groups)
        {
            var used = single >= 0 ? (int)Math.Min(count, left[single]) : 0;
            if (single >= 0)
            {
                left[single] -= used;
                given[single] += used;
            }

            if (count > used && halves != 0)
            {
                spare.Add((halves, count - used));
            }
        }

        // Halves: a maximum flow from spare groups (one unit per part) to classes (two units per fill still short).
        var units = HalfFlow(spare, left.Select(l => (int)Math.Round(2 * l)).ToArray());
        for (var j = 0; j < k; j++)
        {
            left[j] -= units[j] / 2.0;
            given[j] += units[j] / 2.0;
        }

        return (left, given);
    }

    // Augmenting paths on a tiny bipartite graph (groups × classes); returns the units given to each class.
    private static int[] HalfFlow(List<(int Halves, int Count)> spare, int[] capacity)
    {
        var k = capacity.Length;
        var flow = new int[spare.Count, k];
        var given = new int[k];
        var supply = spare.Select(s => s.Count).ToArray();
        while (true)
        {
            // BFS over group nodes 0..g-1 and class nodes g..g+k-1 from any group with supply to any class with room.
            var g = spare.Count;
            var previous = Enumerable.Repeat(-2, g + k).ToArray();
            var queue = new Queue<int>();
            for (var i = 0; i < g; i++)
            {
                if (supply[i] > 0)
                {
                    previous[i] = -1;
                    queue.Enqueue(i);
                }
            }

            var end = -1;
            while (queue.Count > 0 && end < 0)
            {
                var node = queue.Dequeue();
                if (node < g)
                {
                    for (var j = 0; j < k; j++)
                    {
                        if ((spare[node].Halves >> j & 1) == 1 && previous[g + j] == -2)
                        {
                            previous[g + j] = node;
                            if (given[j] < capacity[j])
                            {
                                end = g + j;
                                break;
                            }

                            queue.Enqueue(g + j);
                        }
                    }
                }
                else
                {
                    for (var i = 0; i < g; i++)
                    {
                        if (flow[i, node - g] > 0 && previous[i] == -2)
                        {
                            previous[i] = node;
                            queue.Enqueue(i);
                        }
                    }
                }
            }

            if (end < 0)
            {
                return given;
            }

            given[end - g]++;
            var at = end;
            while (previous[at] != -1)
            {
                var from = previous[at];
                if (at >= g)
                {
                    flow[from, at - g]++;
                }
                else
                {
                    flow[at, from - g]--;
                }

                at = from;
            }

            supply[at]--;
        }
    }
}
