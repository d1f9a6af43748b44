namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The aggregated master of <see cref="BinnedColumnBound"/>: max Σ x_v subject to Σ_v v_b x_v ≤ c_b, x ≥ 0, by the
/// tableau simplex (textbook; Dantzig's rule, Bland's after a run of degenerate pivots), and its optimal duals: the
/// objective row under the slack columns. Tens to a few hundred rows.
/// </summary>
internal static class BinLp
{
    private const double Eps = 1e-10;

    /// <summary>Optimal duals, one per row (≥ 0 up to rounding); null when stopped or the pivot cap was hit.</summary>
    public static double[]? Duals(IReadOnlyList<int[]> columns, double[] capacity, Func<bool> stop)
    {
        int m = capacity.Length,
            n = columns.Count,
            width = n + m + 1;
        var t = new double[m + 1][];
        for (var i = 0; i < m; i++)
        {
            t[i] = new double[width];
            for (var j = 0; j < n; j++)
            {
                t[i][j] = columns[j][i];
            }

            t[i][n + i] = 1;
            t[i][n + m] = capacity[i];
        }

        t[m] = new double[width];
        for (var j = 0; j < n; j++)
        {
            t[m][j] = -1;
        }

        var basis = Enumerable.Range(n, m).ToArray();
        var degenerate = 0;
        for (var iteration = 0; iteration < 100_000; iteration++)
        {
            if ((iteration & 63) == 0 && stop())
            {
                return null;
            }

            var bland = degenerate > 50;
            var enter = -1;
            var most = -Eps;
            for (var j = 0; j < n + m; j++)
            {
                if (t[m][j] < most)
                {
                    (enter, most) = (j, bland ? double.NegativeInfinity : t[m][j]);
                    if (bland)
                    {
                        break;
                    }
                }
            }

            if (enter < 0)
            {
                return [.. Enumerable.Range(0, m).Select(i => t[m][n + i])];
            }

            var leave = -1;
            var ratio = double.PositiveInfinity;
            for (var i = 0; i < m; i++)
            {
                if (t[i][enter] > Eps)
                {
                    var r = t[i][n + m] / t[i][enter];
                    if (r < ratio - Eps || (Math.Abs(r - ratio) <= Eps && basis[i] < basis[leave]))
                    {
                        (ratio, leave) = (r, i);
                    }
                }
            }

            if (leave < 0)
            {
                return null;
            }

            degenerate = ratio <= Eps ? degenerate + 1 : 0;
            Pivot(t, leave, enter);
            basis[leave] = enter;
        }

        return null;
    }

    private static void Pivot(double[][] t, int row, int col)
    {
        var pr = t[row];
        var p = pr[col];
        for (var j = 0; j < pr.Length; j++)
        {
            pr[j] /= p;
        }

        for (var i = 0; i < t.Length; i++)
        {
            var f = t[i][col];
            if (i == row || f == 0)
            {
                continue;
            }

            var ti = t[i];
            for (var j = 0; j < ti.Length; j++)
            {
                ti[j] -= f * pr[j];
            }
        }
    }
}
