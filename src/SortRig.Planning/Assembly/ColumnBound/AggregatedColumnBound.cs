namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The set-packing LP bound by column generation over an aggregated master (<see cref="PartAggregation"/>), for reels
/// too large for a master with a row per part. Stage by stage the scarcest parts get rows of their own (first
/// <see cref="FirstOwn"/>, then twice as many, up to every part: then the master is the part LP itself); the pooled
/// parts of one nominal share a row. Every round prices exactly at the part duals the master gives, and Σ y / m is a
/// proven bound for any y ≥ 0 and m the pricing's proven minimum (LP duality, textbook; the rounding of Farley 1990,
/// from memory), so the best bound over all rounds and stages is kept. Without pooling, the duals of the 1 000-part
/// ratio-set reel leave some feasible set of zero-dual parts until the LP converges (m = 0, no bound), and the master
/// with a row per part needs minutes; the part LP's optimal duals there are one price per nominal except for a few
/// parts in the tails (docs/planning.md), which is what the pooled master can express with few rows.
/// </summary>
internal static class AggregatedColumnBound
{
    /// <summary>Parts on their own rows in the first stage.</summary>
    public const int FirstOwn = 128;

    /// <summary>Runs the stages; null when no round produced a bound before <paramref name="stop"/>.</summary>
    /// <param name="pricing">Exact pricing (or a proven lower bound) over a family holding every feasible set.</param>
    /// <param name="z">Per usable part, ln(value / nominal).</param>
    /// <param name="classOf">Per usable part, the index of its nominal.</param>
    /// <param name="window">Match window on z.</param>
    /// <param name="initial">Starting columns (sets of distinct parts).</param>
    /// <param name="stop">True when time is up; the best bound so far is returned.</param>
    /// <param name="firstOwn">Parts on their own rows in the first stage.</param>
    /// <param name="columnsPerRound">Columns priced per round.</param>
    /// <param name="allStages">Go on after the first stage that converges (up to every part on its own row); by
    /// default the first converged stage ends the run, leaving the rest of the time to the search.</param>
    public static ColumnBoundResult? Solve(
        IColumnPricing pricing,
        double[] z,
        int[] classOf,
        double window,
        IEnumerable<int[]> initial,
        Func<bool> stop,
        int firstOwn = FirstOwn,
        int columnsPerRound = 1000,
        bool allStages = false
    )
    {
        var n = z.Length;
        var order = PartAggregation.ScarcityOrder(z, classOf, window);
        var sets = new List<int[]>();
        var keys = new HashSet<string>();
        void Keep(int[] s)
        {
            var sorted = s.Order().ToArray();
            if (keys.Add(string.Join(',', sorted)))
            {
                sets.Add(sorted);
            }
        }

        foreach (var s in initial)
        {
            Keep(s);
        }

        ColumnBoundResult? best = null;
        var rounds = 0;
        // Every set seen (part level) goes to the packing with the result.
        ColumnBoundResult? WithPool(ColumnBoundResult? r) =>
            r is null ? null : r with { Pool = sets, PoolValues = new double[sets.Count] };
        for (var own = Math.Min(n, firstOwn); !stop(); own = Math.Min(n, Math.Max(1, 2 * own)))
        {
            var rows = new PartAggregation(order, own, classOf);
            var master = new PackingMaster(rows.Rows);
            foreach (var s in sets)
            {
                master.Add(rows.Column(s));
            }

            var family = string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"{pricing.Family}; pooled master: {own} of {n} parts on rows of their own, the rest one row per "
                    + $"nominal"
            );
            while (!stop())
            {
                rounds++;
                master.Solve(200_000, stop);
                var y = rows.PartDuals(master.Duals);
                var priced = pricing.Price(y, columnsPerRound, stop);
                if (double.IsNaN(priced.Min))
                {
                    return WithPool(best);
                }

                var converged = priced.Columns.Count == 0;
                best = ColumnBoundResult.Better(best, y, priced, master.ColumnCount, rounds, () => family);

                var added = 0;
                foreach (var c in priced.Columns)
                {
                    Keep(c);
                    added += master.Add(rows.Column(c)) ? 1 : 0;
                }

                if (converged && (own == n || !allStages))
                {
                    return WithPool(best is null ? null : best with { Rounds = rounds });
                }

                if (converged || added == 0)
                {
                    break;
                }
            }

            if (own == n)
            {
                break;
            }
        }

        return WithPool(best is null ? null : best with { Rounds = rounds });
    }
}
