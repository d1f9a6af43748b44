using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Pricing of the column bound for network recipes of few positions at reel scale, exact over the feasible sets (or a
/// proven lower bound on their minimum). The search runs within the <b>relaxed family</b> of assignments (one option
/// per position, single or pair, no part twice) whose every output error at the parts' measured values is within its
/// tolerance, uncertainty dropped: every feasible set is in it, because the real rule adds Σ_k |∂error/∂R_k| U_k ≥ 0
/// to |error| (docs/planning.md). Within it, members are judged by the real rule (<see cref="NetworkRule"/>) in
/// increasing cost, so the first that meets every spec gives a leaf's exact minimum over feasible sets and a column;
/// a leaf cut short reports the cost of its cheapest member not judged, a lower bound. Then Σ y / min is a proven
/// bound (LP duality; Farley 1990, from memory).
/// <para>
/// Structure. One position, the one with the most options (the divider's R3 with its parallel pairs), is the
/// <i>last</i>; the others form the prefix. The prefix is enumerated depth first; a prefix value is kept only when
/// the box of the positions still open (each the hull of its offered values) can meet every output, each on its own,
/// decided exactly at the box's vertices (the monotonicity argument of <see cref="NetworkPartFilter"/>: with the other
/// resistances fixed every output is linear-fractional, so monotone, in one resistance; so the extremes over a box lie
/// at vertices). This prunes only assignments outside the family. With the whole prefix fixed, each output error is a
/// monotone function of the last position's value, so the last values meeting output o form an interval, found by
/// bisection over the values sorted (the direction of each output from the two extreme values); the family's members
/// with that prefix are exactly the options in the intersection of those intervals. These (prefix, interval) leaves do
/// not depend on the duals and are built once; each pricing is then, per leaf, the prefix's cost plus the cheapest
/// option of the interval not sharing a part with the prefix (a sparse table for range minima, split around an option
/// that shares a part) as a lower bound, leaves in its order, and the options of a leaf by a heap over sub-ranges.
/// </para>
/// Comparisons are widened by 1e-9 of the tolerance so that rounding can only add members to the family.
/// </summary>
internal sealed class NetworkPricing : IColumnPricing
{
    /// <summary>Most positions priced this way (the prefix is enumerated; see
    /// <see cref="ColumnBoundStep.MaxNetworkPositions"/> for what the assembler uses at reel scale).</summary>
    public const int MaxPositions = 4;

    private const double Slack = 1 + 1e-9;

    /// <summary>Options judged per leaf and pricing before the leaf's minimum is replaced by a lower bound.</summary>
    private const int Tries = 200;

    /// <summary>Leaves judged in full per pricing only to find columns (not to lower the minimum).</summary>
    private const int MaxScans = 40;
    private readonly RecipeNetwork _network;
    private readonly NetworkRule _rule;
    private readonly int[] _order;
    private readonly Option[][] _options;
    private readonly double[][] _values;
    private readonly List<int[]> _leaves = [];
    private readonly Dictionary<int, int[]> _feasible = [];

    // Verdicts of the real rule per (leaf, option), kept across pricing rounds (they do not depend on the duals).
    private readonly Dictionary<long, bool> _judged = [];
    private readonly double[] _tolerance;
    private readonly int _last;
    private readonly int _maxLeaves;

    private NetworkPricing(Recipe recipe, CandidatePool pool, NetworkRule rule, int maxLeaves)
    {
        _network = rule.Network;
        _rule = rule;
        _maxLeaves = maxLeaves;
        var n = recipe.Positions.Count;
        _options = new Option[n][];
        _values = new double[n][];
        for (var k = 0; k < n; k++)
        {
            _options[k] = [.. pool.Options[k].OrderBy(o => o.Value)];
            _values[k] = [.. _options[k].Select(o => o.Value)];
        }

        _last = Enumerable.Range(0, n).MaxBy(k => _options[k].Length);
        _order = [.. Enumerable.Range(0, n).Where(k => k != _last), _last];
        var nominal = recipe.Positions.Select(p => p.Nominal).ToArray();
        _tolerance = [.. _network.Evaluate(nominal).Select(o => o.Tolerance * Slack)];
    }

    public string Family =>
        "every feasible set (the real rule), searched by interval within the assignments meeting every output at "
        + "the measured values";

    /// <summary>Leaves (prefix assignments with a non-empty interval of the last position).</summary>
    public int Leaves => _leaves.Count;

    /// <summary>
    /// The pricing, or null when the recipe is not a network of at most <see cref="MaxPositions"/> positions, the
    /// leaves exceed <paramref name="maxLeaves"/>, or <paramref name="stop"/> cut the build short.
    /// </summary>
    public static NetworkPricing? TryCreate(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options,
        Func<bool> stop,
        int maxLeaves = 2_000_000
    )
    {
        if (recipe.Form != RecipeForm.Network || recipe.Positions.Count > MaxPositions || recipe.Positions.Count < 2)
        {
            return null;
        }

        var pool = new CandidatePool(recipe, usable, options, withPairs: true);
        if (pool.Usable.Count != usable.Count || pool.Options.Any(o => o.Count == 0))
        {
            return null;
        }

        var pricing = new NetworkPricing(recipe, pool, new NetworkRule(recipe), maxLeaves);
        return pricing.Build(stop) ? pricing : null;
    }

    /// <summary>
    /// True when some member of the searched family (a leaf's prefix with an option of its interval) uses exactly these
    /// parts (indices into the usable parts): the family must hold every feasible set. For tests; O(leaves × options).
    /// </summary>
    public bool Covers(IReadOnlyCollection<int> parts)
    {
        var set = parts.ToHashSet();
        foreach (var leaf in _leaves)
        {
            var used = new HashSet<int>();
            for (var d = 0; d < _order.Length - 1; d++)
            {
                var o = _options[_order[d]][leaf[d]];
                used.Add(o.A);
                if (o.B >= 0)
                {
                    used.Add(o.B);
                }
            }

            if (!used.IsSubsetOf(set))
            {
                continue;
            }

            for (var j = leaf[^2]; j <= leaf[^1]; j++)
            {
                var o = _options[_last][j];
                var all = new HashSet<int>(used) { o.A };
                if (o.B >= 0)
                {
                    all.Add(o.B);
                }

                if (all.Count == used.Count + (o.B >= 0 ? 2 : 1) && all.SetEquals(set))
                {
                    return true;
                }
            }
        }

        return false;
    }

    private bool Build(Func<bool> stop)
    {
        var n = _order.Length;
        var lo = new double[n];
        var hi = new double[n];
        for (var k = 0; k < n; k++)
        {
            (lo[k], hi[k]) = (_values[k][0], _values[k][^1]);
        }

        var chosen = new int[n - 1];
        var used = new HashSet<int>();
        return Prefix(0, lo, hi, chosen, used, stop);
    }

    private bool Prefix(int depth, double[] lo, double[] hi, int[] chosen, HashSet<int> used, Func<bool> stop)
    {
        var k = _order[depth];
        var (saveLo, saveHi) = (lo[k], hi[k]);
        var options = _options[k];
        for (var j = 0; j < options.Length; j++)
        {
            var o = options[j];
            if (used.Contains(o.A) || (o.B >= 0 && used.Contains(o.B)))
            {
                continue;
            }

            (lo[k], hi[k]) = (o.Value, o.Value);
            if (!BoxVertices.CanMeet(_network, lo, hi, _tolerance))
            {
                continue;
            }

            chosen[depth] = j;
            if (depth == _order.Length - 2)
            {
                var (a, b) = LastInterval(lo);
                if (a <= b)
                {
                    _leaves.Add([.. chosen, a, b]);
                    if (_leaves.Count > _maxLeaves || ((_leaves.Count & 1023) == 0 && stop()))
                    {
                        return false;
                    }
                }

                continue;
            }

            used.Add(o.A);
            if (o.B >= 0)
            {
                used.Add(o.B);
            }

            var ok = Prefix(depth + 1, lo, hi, chosen, used, stop);
            used.Remove(o.A);
            used.Remove(o.B);
            if (!ok)
            {
                return false;
            }
        }

        (lo[k], hi[k]) = (saveLo, saveHi);
        return !stop();
    }

    // Can some point of the box meet every output, each on its own? Exact at the vertices (class comment).
    // With every prefix position fixed in x, the indices [a, b] of the last position's options meeting every output.
    private (int A, int B) LastInterval(double[] x)
    {
        var values = _values[_last];
        var outputs = _tolerance.Length;
        var e0 = ErrorsAt(x, values[0]);
        var e1 = ErrorsAt(x, values[^1]);
        var dir = new int[outputs];
        for (var o = 0; o < outputs; o++)
        {
            if (!double.IsFinite(e0[o]) || !double.IsFinite(e1[o]))
            {
                return (0, values.Length - 1);
            }

            var d = e1[o] - e0[o];
            dir[o] =
                Math.Abs(d) <= 1e-9 * _tolerance[o] ? 0
                : d > 0 ? 1
                : -1;
            // An output (nearly) constant in this position: met everywhere or nowhere.
            if (dir[o] == 0 && Math.Min(Math.Abs(e0[o]), Math.Abs(e1[o])) > _tolerance[o])
            {
                return (1, 0);
            }
        }

        // Up(j): every output past its lower edge (an up-set in j); Down(j): before its upper edge (a down-set).
        bool Up(double[] e)
        {
            for (var o = 0; o < outputs; o++)
            {
                if ((dir[o] > 0 && e[o] < -_tolerance[o]) || (dir[o] < 0 && e[o] > _tolerance[o]))
                {
                    return false;
                }
            }

            return true;
        }

        bool Down(double[] e)
        {
            for (var o = 0; o < outputs; o++)
            {
                if ((dir[o] > 0 && e[o] > _tolerance[o]) || (dir[o] < 0 && e[o] < -_tolerance[o]))
                {
                    return false;
                }
            }

            return true;
        }

        if (!Up(e1) || !Down(e0))
        {
            return (1, 0);
        }

        // Smallest j with Up, largest with Down.
        int lo = 0,
            hi = values.Length - 1;
        if (!Up(e0))
        {
            while (hi - lo > 1)
            {
                var mid = (lo + hi) / 2;
                (lo, hi) = Up(ErrorsAt(x, values[mid])) ? (lo, mid) : (mid, hi);
            }

            lo = hi;
        }

        var a = lo;
        (lo, hi) = (0, values.Length - 1);
        if (!Down(e1))
        {
            while (hi - lo > 1)
            {
                var mid = (lo + hi) / 2;
                (lo, hi) = Down(ErrorsAt(x, values[mid])) ? (mid, hi) : (lo, mid);
            }

            hi = lo;
        }

        // Equal values share one verdict: widen to every option of the same value (rounding only adds members).
        var b = hi;
        while (a > 0 && values[a - 1] == values[a])
        {
            a--;
        }

        while (b < values.Length - 1 && values[b + 1] == values[b])
        {
            b++;
        }

        return (a, b);
    }

    private double[] ErrorsAt(double[] x, double last)
    {
        var saved = x[_last];
        x[_last] = last;
        var e = new double[_tolerance.Length];
        _network.Errors(x, e);
        x[_last] = saved;
        return e;
    }

    public PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop)
    {
        var last = _options[_last];
        var cost = new double[last.Length];
        for (var j = 0; j < last.Length; j++)
        {
            cost[j] = duals[last[j].A] + (last[j].B >= 0 ? duals[last[j].B] : 0);
        }

        var table = new RangeMin(cost);
        // Per leaf a lower bound: the prefix's cost plus the cheapest option of its interval (every member of the
        // leaf costs at least that); leaves in increasing order of it.
        var lower = new List<(double Bound, double Prefix, int Leaf)>();
        var parts = new List<int>(2 * _order.Length);
        for (var l = 0; l < _leaves.Count; l++)
        {
            var leaf = _leaves[l];
            var prefix = PrefixParts(leaf, duals, parts);
            var (best, at) = Cheapest(table, last, parts, leaf[^2], leaf[^1]);
            if (at >= 0)
            {
                lower.Add((prefix + best, prefix, l));
            }
        }

        var y = duals.ToArray(); // a span cannot enter the lambda
        return LeafScan.Run(lower, maxColumns, MaxScans, stop, (l, prefix, mayScan) =>
            LeafMin(table, l, prefix, y, mayScan)
        );
    }

    private double PrefixParts(int[] leaf, ReadOnlySpan<double> duals, List<int> parts)
    {
        var prefix = 0.0;
        parts.Clear();
        for (var d = 0; d < _order.Length - 1; d++)
        {
            var o = _options[_order[d]][leaf[d]];
            prefix += duals[o.A] + (o.B >= 0 ? duals[o.B] : 0);
            parts.Add(o.A);
            if (o.B >= 0)
            {
                parts.Add(o.B);
            }
        }

        return prefix;
    }

    /// <summary>
    /// The smallest cost of a truly feasible set of the leaf (the real rule, uncertainty included) with that set, by
    /// the options of its interval in increasing cost; after <see cref="Tries"/> options judged, a lower bound (the
    /// cost of the cheapest option not yet judged) and no set.
    /// </summary>
    private (double Min, int[]? Set, bool Scanned) LeafMin(
        RangeMin table,
        int leafIndex,
        double prefix,
        ReadOnlySpan<double> duals,
        bool mayScan
    )
    {
        var leaf = _leaves[leafIndex];
        if (_feasible.ContainsKey(leafIndex))
        {
            var f = new Option[_order.Length];
            for (var d = 0; d < _order.Length - 1; d++)
            {
                f[_order[d]] = _options[_order[d]][leaf[d]];
            }

            var (m, set) = Scanned(leafIndex, prefix, duals, f);
            return (m, set, false);
        }

        var last = _options[_last];
        var fills = new Option[_order.Length];
        var parts = new List<int>();
        _ = PrefixParts(leaf, duals, parts);
        for (var d = 0; d < _order.Length - 1; d++)
        {
            fills[_order[d]] = _options[_order[d]][leaf[d]];
        }

        var heap = new PriorityQueue<(int A, int B, int At), double>();
        // A sub-range's middle option when it ties with the sub-range's minimum (zero duals tie often): options near
        // the middle of a leaf's interval meet the specs with their uncertainty more often than those at its edges.
        void Push(int a, int b)
        {
            if (a <= b)
            {
                var at = table.ArgMin(a, b);
                var mid = (a + b) / 2;
                heap.Enqueue((a, b, table.Values[mid] <= table.Values[at] ? mid : at), table.Values[at]);
            }
        }

        Push(leaf[^2], leaf[^1]);
        for (var tries = 0; heap.TryDequeue(out var r, out var cost); )
        {
            var o = last[r.At];
            if (!parts.Contains(o.A) && (o.B < 0 || !parts.Contains(o.B)))
            {
                if (tries++ == Tries)
                {
                    if (!mayScan)
                    {
                        return (prefix + cost, null, false);
                    }

                    var (m, set) = Scanned(leafIndex, prefix, duals, fills);
                    return (m, set, true);
                }

                fills[_last] = o;
                var key = ((long)leafIndex << 32) | (uint)r.At;
                if (!_judged.TryGetValue(key, out var meets))
                {
                    meets = _rule.Judge(fills).Meets;
                    _judged[key] = meets;
                }

                if (meets)
                {
                    return (prefix + cost, [.. fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A])], false);
                }
            }

            Push(r.A, r.At - 1);
            Push(r.At + 1, r.B);
        }

        return (double.PositiveInfinity, null, false);
    }

    // Every option of the leaf's interval judged once (dual-independent, cached): the exact minimum over the leaf's
    // feasible sets from then on; a leaf with none is dead.
    private (double Min, int[]? Set) Scanned(int leafIndex, double prefix, ReadOnlySpan<double> duals, Option[] fills)
    {
        if (!_feasible.TryGetValue(leafIndex, out var list))
        {
            var feasible = new List<int>();
            var leaf = _leaves[leafIndex];
            var parts = fills.Where((_, k) => k != _last).SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]);
            var used = parts.ToHashSet();
            for (var j = leaf[^2]; j <= leaf[^1]; j++)
            {
                var o = _options[_last][j];
                if (!used.Contains(o.A) && !used.Contains(o.B))
                {
                    fills[_last] = o;
                    if (_rule.Judge(fills).Meets)
                    {
                        feasible.Add(j);
                    }
                }
            }

            list = [.. feasible];
            _feasible[leafIndex] = list;
        }

        var best = -1;
        var min = double.PositiveInfinity;
        foreach (var j in list)
        {
            var o = _options[_last][j];
            var c = duals[o.A] + (o.B >= 0 ? duals[o.B] : 0);
            if (c < min)
            {
                (min, best) = (c, j);
            }
        }

        if (best < 0)
        {
            return (double.PositiveInfinity, null);
        }

        fills[_last] = _options[_last][best];
        return (prefix + min, [.. fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A])]);
    }

    // Cheapest option in [a, b] sharing no part with the prefix; split around one that does.
    private static (double Cost, int At) Cheapest(RangeMin table, Option[] last, List<int> parts, int a, int b)
    {
        if (a > b)
        {
            return (double.PositiveInfinity, -1);
        }

        var at = table.ArgMin(a, b);
        var o = last[at];
        if (!parts.Contains(o.A) && (o.B < 0 || !parts.Contains(o.B)))
        {
            return (table.Values[at], at);
        }

        var left = Cheapest(table, last, parts, a, at - 1);
        var right = Cheapest(table, last, parts, at + 1, b);
        return left.Cost <= right.Cost ? left : right;
    }
}
