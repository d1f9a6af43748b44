namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The LP relaxation of set packing (parts are rows of capacity 1, every feasible set a column worth 1) by column
/// generation, with a bound that holds at every round (LP duality, textbook; the rounding of Farley 1990, from
/// memory): for duals y ≥ 0 and m &gt; 0 at most min_S Σ_{i∈S} y_i over every feasible set S, y / m satisfies every
/// dual constraint Σ_{i∈S} y_i / m ≥ 1, so the LP optimum, and with it the number of disjoint sets, is at most
/// Σ y / m. The master's duals are only a guide (clipped at 0); validity rests on the pricing's m alone.
/// </summary>
internal static class ColumnBoundSolver
{
    /// <summary>Runs column generation; null when no round produced a bound before <paramref name="stop"/>.</summary>
    /// <param name="pricing">Exact pricing (or a proven lower bound) over a family holding every feasible set.</param>
    /// <param name="rows">Number of parts.</param>
    /// <param name="initial">Starting columns (e.g. sets already found); any sets of parts will do.</param>
    /// <param name="stop">True when time is up; the best bound so far is returned.</param>
    /// <param name="columnsPerRound">Columns added per pricing round.</param>
    public static ColumnBoundResult? Solve(
        IColumnPricing pricing,
        int rows,
        IEnumerable<int[]> initial,
        Func<bool> stop,
        int columnsPerRound = 200
    )
    {
        var master = new ColumnMaster(rows);
        foreach (var c in initial)
        {
            master.Add(c);
        }

        ColumnBoundResult? best = null;
        for (var round = 1; !stop(); round++)
        {
            master.Solve(200_000, stop);
            var y = new double[rows];
            var duals = master.Duals;
            for (var i = 0; i < rows; i++)
            {
                y[i] = Math.Max(0, duals[i]);
            }

            var priced = pricing.Price(y, columnsPerRound, stop);
            if (double.IsNaN(priced.Min))
            {
                break;
            }

            var converged = priced.Columns.Count == 0;
            best = ColumnBoundResult.Better(best, y, priced, master.ColumnCount, round, () => pricing.Family);

            var added = 0;
            foreach (var c in priced.Columns)
            {
                added += master.Add(c) ? 1 : 0;
            }

            if (converged || added == 0)
            {
                return best is null
                    ? null
                    : best with
                    {
                        Rounds = round,
                        Converged = converged,
                        Pool = master.AllColumns,
                        PoolValues = master.Primal(),
                    };
            }
        }

        return best is null ? null : best with { Pool = master.AllColumns, PoolValues = master.Primal() };
    }
}
