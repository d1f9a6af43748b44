using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Pricing for the matched form: the smallest Σ y over a family of sets that contains every feasible set. A set is
/// feasible when one window [a, a + W] on z = ln(value / position nominal) holds [Lo, Hi] = [ln((x−U)/n),
/// ln((x+U)/n)] of every option (single or pair), W = ln(1 + tolerance), which is <see cref="MatchedRule"/>. The low
/// edge a is swept over a grid of step g; a feasible set whose admissible edges include a lies inside the grid window
/// [⌊a/g⌋g, ⌊a/g⌋g + W + g], so the family priced is "distinct parts, every option inside some grid window of width
/// W + g" — a superset of the feasible sets, hence its minimum is a proven lower bound on theirs.
/// Per window and per position only the cheapest options are kept, until they hold K mutually disjoint ones, K = 1 +
/// the parts the other positions can use; an exchange argument shows some cheapest assignment uses only kept options
/// (any other option costs at least as much as every kept one, and at most K − 1 of the K disjoint ones meet the other
/// positions' parts). The assignment with distinct parts is then found by depth-first search with bounding.
/// </summary>
internal sealed class MatchedPricing : IColumnPricing
{
    private readonly double _window;
    private readonly double _step;
    private readonly double _lowStart;
    private readonly int _windows;
    private readonly OptionList[] _groups;
    private readonly int[] _groupOf;
    private readonly int[] _need;

    public MatchedPricing(Recipe recipe, IReadOnlyList<PartCandidate> usable, AssemblyOptions options, int gridSteps)
    {
        var rule = new MatchedRule(recipe);
        _window = rule.Window * (1 + 1e-9);
        _step = rule.Window / gridSteps;
        var positions = recipe.Positions;
        var keys = new List<(double Nominal, PairBuilds Pairs)>();
        _groupOf = new int[positions.Count];
        var groups = new List<OptionList>();
        for (var k = 0; k < positions.Count; k++)
        {
            var key = (positions[k].Nominal, positions[k].Pairs);
            var g = keys.IndexOf(key);
            if (g < 0)
            {
                g = keys.Count;
                keys.Add(key);
                groups.Add(OptionList.Build(positions[k], k, rule, usable, options));
            }

            _groupOf[k] = g;
        }

        _groups = [.. groups];
        var partsOf = positions.Select(p => p.Pairs == PairBuilds.None ? 1 : 2).ToArray();
        _need = new int[groups.Count];
        for (var k = 0; k < positions.Count; k++)
        {
            _need[_groupOf[k]] = Math.Max(_need[_groupOf[k]], 1 + partsOf.Sum() - partsOf[k]);
        }

        var lo = _groups.Where(g => g.Count > 0).Select(g => g.MinLo).DefaultIfEmpty(0).Min();
        var hi = _groups.Where(g => g.Count > 0).Select(g => g.MaxHi).DefaultIfEmpty(0).Max();
        _lowStart = Math.Floor(lo / _step) * _step;
        _windows = _groups.Any(g => g.Count == 0) ? 0 : Math.Max(1, (int)Math.Ceiling((hi - _lowStart) / _step) + 1);
        Positions = positions.Count;
    }

    public int Positions { get; }

    public string Family =>
        string.Create(
            System.Globalization.CultureInfo.InvariantCulture,
            $"sets of distinct parts within a match window widened by 1/{Math.Round(_window / _step)}"
        );

    public PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop)
    {
        var y = duals.ToArray();
        var heaps = _groups.Select(_ => new PriorityQueue<int, double>()).ToArray();
        var next = new int[_groups.Length];
        var kept = _groups.Select(_ => new List<int>()).ToArray();
        var fills = new int[Positions];
        var best = new int[Positions];
        var min = double.PositiveInfinity;
        var found = new List<(double Cost, int[] Parts)>();
        var order = Enumerable.Range(0, Positions).ToArray();
        var partners = new Dictionary<int, HashSet<int>>();
        var passed = new List<int>();
        for (var w = 0; w < _windows; w++)
        {
            if ((w & 255) == 0 && stop())
            {
                return new PricingResult(double.NaN, []);
            }

            var left = _lowStart + (w * _step);
            var right = left + _window + _step;
            var empty = false;
            for (var g = 0; g < _groups.Length; g++)
            {
                var list = _groups[g];
                while (next[g] < list.Count && list.Hi[next[g]] <= right)
                {
                    heaps[g].Enqueue(next[g], y[list.A[next[g]]] + (list.B[next[g]] >= 0 ? y[list.B[next[g]]] : 0));
                    next[g]++;
                }

                Cheapest(list, heaps[g], left, _need[g], y, kept[g], partners, passed);
                empty |= kept[g].Count == 0;
            }

            if (empty)
            {
                continue;
            }

            // Positions with the fewest kept options first; the bound is the sum of each one's cheapest.
            Array.Sort(order, (p, q) => kept[_groupOf[p]].Count.CompareTo(kept[_groupOf[q]].Count));
            var floor = 0.0;
            foreach (var k in order)
            {
                floor += Cost(_groups[_groupOf[k]], kept[_groupOf[k]][0], y);
            }

            // The window cannot lower the minimum nor give a column that prices out: skip it.
            if (floor >= min && floor >= 1 - 1e-9)
            {
                continue;
            }

            var exact = double.PositiveInfinity;
            Search(0, 0.0, order, kept, y, fills, best, ref exact, []);
            min = Math.Min(min, exact);
            if (exact < 1 - 1e-9)
            {
                found.Add((exact, PartsOf(best)));
            }
        }

        return new PricingResult(min, Spread(found, maxColumns));
    }

    // Cheapest first, but sets disjoint from those already taken before the rest: the master then gains a packing
    // of new sets per round rather than many variants of one.
    internal static List<int[]> Spread(List<(double Cost, int[] Parts)> found, int maxColumns)
    {
        var sorted = found
            .OrderBy(f => f.Cost)
            .Select(f => f.Parts)
            .DistinctBy(p => string.Join(',', p.Order()))
            .ToList();
        var taken = new HashSet<int>();
        var first = new List<int[]>();
        var rest = new List<int[]>();
        foreach (var p in sorted)
        {
            if (p.All(i => !taken.Contains(i)))
            {
                first.Add(p);
                taken.UnionWith(p);
            }
            else
            {
                rest.Add(p);
            }
        }

        return [.. first.Concat(rest).Take(maxColumns)];
    }

    private int[] PartsOf(int[] best)
    {
        var parts = new List<int>();
        for (var k = 0; k < Positions; k++)
        {
            var list = _groups[_groupOf[k]];
            parts.Add(list.A[best[k]]);
            if (list.B[best[k]] >= 0)
            {
                parts.Add(list.B[best[k]]);
            }
        }

        return [.. parts];
    }

    private static double Cost(OptionList list, int o, double[] y) =>
        y[list.A[o]] + (list.B[o] >= 0 ? y[list.B[o]] : 0);

    private void Search(
        int depth,
        double cost,
        int[] order,
        List<int>[] kept,
        double[] y,
        int[] fills,
        int[] best,
        ref double bestCost,
        HashSet<int> used
    )
    {
        if (depth == order.Length)
        {
            if (cost < bestCost)
            {
                bestCost = cost;
                Array.Copy(fills, best, fills.Length);
            }

            return;
        }

        var rest = 0.0;
        for (var d = depth + 1; d < order.Length; d++)
        {
            rest += Cost(_groups[_groupOf[order[d]]], kept[_groupOf[order[d]]][0], y);
        }

        var k = order[depth];
        var list = _groups[_groupOf[k]];
        foreach (var o in kept[_groupOf[k]])
        {
            var c = Cost(list, o, y);
            if (cost + c + rest >= bestCost)
            {
                break; // kept options are in cost order
            }

            var a = list.A[o];
            var b = list.B[o];
            if (used.Contains(a) || (b >= 0 && used.Contains(b)))
            {
                continue;
            }

            used.Add(a);
            if (b >= 0)
            {
                used.Add(b);
            }

            fills[k] = o;
            Search(depth + 1, cost + c, order, kept, y, fills, best, ref bestCost, used);
            used.Remove(a);
            if (b >= 0)
            {
                used.Remove(b);
            }
        }
    }

    // The cheapest admissible options in cost order until `need` of them are mutually disjoint (or none are left).
    // Options whose Lo is below the window's left edge never come back (the edge only rises) and are dropped. A pair
    // is passed over (but stays in the heap) once one of its parts is already in `need` kept options with distinct
    // partners: a cheapest assignment using it could swap it for one of those, whose other part is free since the
    // other positions use at most need − 1 parts (the exchange argument of the class comment, per part).
    private static void Cheapest(
        OptionList list,
        PriorityQueue<int, double> heap,
        double left,
        int need,
        double[] y,
        List<int> kept,
        Dictionary<int, HashSet<int>> partners,
        List<int> passed
    )
    {
        kept.Clear();
        passed.Clear();
        partners.Clear();
        var disjoint = 0;
        var taken = new HashSet<int>();
        while (disjoint < need && heap.TryDequeue(out var o, out _))
        {
            if (list.Lo[o] < left)
            {
                continue;
            }

            var a = list.A[o];
            var b = list.B[o];
            if (b >= 0 && (Saturated(partners, a, b, need) || Saturated(partners, b, a, need)))
            {
                passed.Add(o);
                continue;
            }

            kept.Add(o);
            if (b >= 0)
            {
                Partners(partners, a).Add(b);
                Partners(partners, b).Add(a);
            }

            if (!taken.Contains(a) && (b < 0 || !taken.Contains(b)))
            {
                disjoint++;
                taken.Add(a);
                if (b >= 0)
                {
                    taken.Add(b);
                }
            }
        }

        foreach (var o in kept.Concat(passed))
        {
            heap.Enqueue(o, Cost(list, o, y));
        }
    }

    private static bool Saturated(Dictionary<int, HashSet<int>> partners, int part, int other, int need) =>
        partners.TryGetValue(part, out var set) && set.Count - (set.Contains(other) ? 1 : 0) >= need;

    private static HashSet<int> Partners(Dictionary<int, HashSet<int>> partners, int part)
    {
        if (!partners.TryGetValue(part, out var set))
        {
            set = [];
            partners[part] = set;
        }

        return set;
    }
}
