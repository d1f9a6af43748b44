namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The column bound with duals equal within bins of parts, for reels where the full master (one row per part) stalls
/// (the difference amplifiers: on a 1 000-part reel it stayed at the sweep's count for a minute, every new column
/// entering at level 0). Parts of one nominal are cut, in order of value, into at most <see cref="BinsPerNominal"/>
/// bins of equal count; the master is the aggregated LP max Σ x_v subject to Σ_v v_b x_v ≤ |bin b| over the bin-count
/// vectors v of the columns found, a small dense LP (<see cref="BinLp"/>). Its duals w give part duals y_i = w_bin(i)
/// ≥ 0, and the pricing's proven minimum m over every feasible set gives the bound Σ y / m at every round (LP duality,
/// textbook; Farley 1990, from memory), exactly as in <see cref="ColumnBoundSolver"/>: any y ≥ 0 will do, so binning
/// can only cost tightness. With every part its own bin (small instances) it is the set-packing LP itself.
/// </summary>
internal static class BinnedColumnBound
{
    /// <summary>Most bins per nominal value.</summary>
    public const int BinsPerNominal = 60;

    public static ColumnBoundResult? Solve(
        IColumnPricing pricing,
        IReadOnlyList<PartCandidate> usable,
        IEnumerable<int[]> initial,
        Func<bool> stop,
        int columnsPerRound = 200,
        int binsPerNominal = BinsPerNominal
    )
    {
        var (binOf, capacity) = Bins(usable, binsPerNominal);
        var vectors = new List<int[]>();
        var keys = new HashSet<string>();
        var pool = new List<int[]>();
        var inPool = new HashSet<string>();
        bool Add(int[] set)
        {
            var sorted = set.Order().ToArray();
            if (inPool.Add(string.Join(',', sorted)))
            {
                pool.Add(sorted);
            }

            var v = new int[capacity.Length];
            foreach (var i in set)
            {
                v[binOf[i]]++;
            }

            if (!keys.Add(string.Join(',', v)))
            {
                return false;
            }

            vectors.Add(v);
            return true;
        }

        foreach (var c in initial)
        {
            _ = Add(c);
        }

        ColumnBoundResult? best = null;
        for (var round = 1; !stop(); round++)
        {
            var w = BinLp.Duals(vectors, capacity, stop);
            if (w is null)
            {
                break;
            }

            var y = new double[usable.Count];
            for (var i = 0; i < y.Length; i++)
            {
                y[i] = Math.Max(0, w[binOf[i]]);
            }

            var priced = pricing.Price(y, columnsPerRound, stop);
            if (double.IsNaN(priced.Min))
            {
                break;
            }

            var converged = priced.Columns.Count == 0;
            best = ColumnBoundResult.Better(best, y, priced, vectors.Count, round, () =>
                pricing.Family + $"; duals equal within {capacity.Length} bins of parts"
            );

            var added = 0;
            foreach (var c in priced.Columns)
            {
                added += Add(c) ? 1 : 0;
            }

            if (converged || added == 0)
            {
                return best is null
                    ? null
                    : best with
                    {
                        Rounds = round,
                        Converged = converged,
                        Pool = pool,
                        PoolValues = new double[pool.Count],
                    };
            }
        }

        return best is null ? null : best with { Pool = pool, PoolValues = new double[pool.Count] };
    }

    // Bins of equal count per nominal, in order of value.
    private static (int[] BinOf, double[] Capacity) Bins(IReadOnlyList<PartCandidate> usable, int perNominal)
    {
        var binOf = new int[usable.Count];
        var capacity = new List<double>();
        foreach (var group in Enumerable.Range(0, usable.Count).GroupBy(i => usable[i].Nominal))
        {
            var sorted = group.OrderBy(i => usable[i].Value.Value).ToArray();
            var bins = Math.Min(perNominal, sorted.Length);
            var first = capacity.Count;
            capacity.AddRange(Enumerable.Repeat(0.0, bins));
            for (var r = 0; r < sorted.Length; r++)
            {
                var b = first + (int)((long)r * bins / sorted.Length);
                binOf[sorted[r]] = b;
                capacity[b]++;
            }
        }

        return (binOf, [.. capacity]);
    }
}
