namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The aggregated master of <see cref="BinnedColumnBound"/>: max Σ x_v subject to Σ_v v_b x_v ≤ c_b, x ≥ 0, by
/// <see cref="DenseSimplex"/>, and its optimal duals. Tens to a few hundred rows.
/// </summary>
internal static class BinLp
{
    /// <summary>Optimal duals, one per row (≥ 0 up to rounding); null when stopped, unbounded or the pivot cap was
    /// hit.</summary>
    public static double[]? Duals(IReadOnlyList<int[]> columns, double[] capacity, Func<bool> stop)
    {
        var a = new double[capacity.Length][];
        for (var i = 0; i < capacity.Length; i++)
        {
            a[i] = new double[columns.Count];
            for (var j = 0; j < columns.Count; j++)
            {
                a[i][j] = columns[j][i];
            }
        }

        var ones = Enumerable.Repeat(1.0, columns.Count).ToArray();
        return DenseSimplex.Solve(ones, a, capacity, 100_000, stop).Duals;
    }
}
