namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>The pricing rounds of <see cref="RatioPairPricing"/>.</summary>
internal sealed partial class RatioPairPricing
{
    public PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop)
    {
        var cost = new double[_b.Count];
        for (var m = 0; m < cost.Length; m++)
        {
            cost[m] = Cost(BPartsOf(m), duals);
        }

        var table = new RangeMin(cost);
        // Per leaf a lower bound: the a-pair's cost plus the cheapest b-pair of its interval sharing no part with it
        // (every member of the leaf costs at least that); leaves in increasing order of it.
        var lower = new List<(double Bound, double Prefix, int Leaf)>(_leaves.Count);
        for (var l = 0; l < _leaves.Count; l++)
        {
            if ((l & 4095) == 0 && stop())
            {
                return new PricingResult(double.NaN, []);
            }

            var (a, lo, hi) = _leaves[l];
            var parts = APartsOf(a);
            var prefix = Cost(parts, duals);
            var (best, at) = Cheapest(table, parts, lo, hi);
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

    private static double Cost(int[] parts, ReadOnlySpan<double> duals)
    {
        var c = 0.0;
        foreach (var i in parts)
        {
            c += duals[i];
        }

        return c;
    }

    private bool Shares(int m, int[] parts)
    {
        var (x, y) = (_options[_p.K][_b.X[m]], _options[_p.L][_b.Y[m]]);
        foreach (var i in parts)
        {
            if (x.Uses(i) || y.Uses(i))
            {
                return true;
            }
        }

        return false;
    }

    private Option[] Fills(int a, int m)
    {
        var f = new Option[4];
        f[_p.I] = _options[_p.I][_a.X[a]];
        f[_p.J] = _options[_p.J][_a.Y[a]];
        f[_p.K] = _options[_p.K][_b.X[m]];
        f[_p.L] = _options[_p.L][_b.Y[m]];
        return f;
    }

    private bool Meets(int leaf, int a, int m)
    {
        var key = ((long)leaf << 32) | (uint)m;
        if (!_judged.TryGetValue(key, out var meets))
        {
            meets = _rule.Judge(Fills(a, m)).Meets;
            _judged[key] = meets;
        }

        return meets;
    }

    /// <summary>
    /// The smallest cost of a truly feasible set of the leaf (the real rule) with that set, by the b-pairs of its
    /// interval in increasing cost; after <see cref="Tries"/> judged, the leaf is judged in full when allowed and small
    /// enough, otherwise the cost of the cheapest b-pair not yet judged is returned as a lower bound, with no set.
    /// </summary>
    private (double Min, int[]? Set, bool Scanned) LeafMin(
        RangeMin table,
        int leafIndex,
        double prefix,
        ReadOnlySpan<double> duals,
        bool mayScan
    )
    {
        var (a, lo, hi) = _leaves[leafIndex];
        if (_feasible.ContainsKey(leafIndex))
        {
            var (m, set) = Scanned(leafIndex, prefix, duals);
            return (m, set, false);
        }

        var parts = APartsOf(a);
        var heap = new PriorityQueue<(int A, int B, int At), double>();
        // A sub-range's middle b-pair when it ties with the sub-range's minimum (zero duals tie often): b-pairs near
        // the middle of a leaf's interval meet the specs with their uncertainty more often than those at its edges.
        void Push(int from, int to)
        {
            if (from <= to)
            {
                var at = table.ArgMin(from, to);
                var mid = (from + to) / 2;
                heap.Enqueue((from, to, table.Values[mid] <= table.Values[at] ? mid : at), table.Values[at]);
            }
        }

        Push(lo, hi);
        for (var tries = 0; heap.TryDequeue(out var r, out var cost); )
        {
            if (!Shares(r.At, parts))
            {
                if (tries++ == Tries)
                {
                    if (!mayScan || hi - lo + 1 > ScanLimit)
                    {
                        return (prefix + cost, null, false);
                    }

                    var (m, set) = Scanned(leafIndex, prefix, duals);
                    return (m, set, true);
                }

                if (Meets(leafIndex, a, r.At))
                {
                    return (prefix + cost, [.. parts, .. BPartsOf(r.At)], false);
                }
            }

            Push(r.A, r.At - 1);
            Push(r.At + 1, r.B);
        }

        return (double.PositiveInfinity, null, false);
    }

    // Every b-pair of the leaf's interval judged once (dual-independent, cached): the exact minimum over the leaf's
    // feasible sets from then on; a leaf with none is dead.
    private (double Min, int[]? Set) Scanned(int leafIndex, double prefix, ReadOnlySpan<double> duals)
    {
        var (a, lo, hi) = _leaves[leafIndex];
        var parts = APartsOf(a);
        if (!_feasible.TryGetValue(leafIndex, out var list))
        {
            var feasible = new List<int>();
            for (var m = lo; m <= hi; m++)
            {
                if (!Shares(m, parts) && Meets(leafIndex, a, m))
                {
                    feasible.Add(m);
                }
            }

            list = [.. feasible];
            _feasible[leafIndex] = list;
        }

        var best = -1;
        var min = double.PositiveInfinity;
        foreach (var m in list)
        {
            var c = Cost(BPartsOf(m), duals);
            if (c < min)
            {
                (min, best) = (c, m);
            }
        }

        return best < 0 ? (double.PositiveInfinity, null) : (prefix + min, [.. parts, .. BPartsOf(best)]);
    }

    // Cheapest b-pair in [lo, hi] sharing no part with the a-pair; split around one that does.
    private (double Cost, int At) Cheapest(RangeMin table, int[] parts, int lo, int hi)
    {
        if (lo > hi)
        {
            return (double.PositiveInfinity, -1);
        }

        var at = table.ArgMin(lo, hi);
        if (!Shares(at, parts))
        {
            return (table.Values[at], at);
        }

        var left = Cheapest(table, parts, lo, at - 1);
        var right = Cheapest(table, parts, at + 1, hi);
        return left.Cost <= right.Cost ? left : right;
    }
}
