namespace SortRig.Planning.Assembly;

/// <summary>
/// A small dense simplex for max cᵀx subject to Ax ≤ b, x ≥ 0 with b ≥ 0 (the origin is feasible), Bland's rule
/// against cycling. Meant for the tiny linear programmes of the supply bound (tens of rows and columns).
/// </summary>
internal static class DenseSimplex
{
    private const double Eps = 1e-10;

    /// <summary>The optimal objective value; +∞ when unbounded; NaN when the iteration cap is hit.</summary>
    public static double Maximize(double[] c, double[][] a, double[] b)
    {
        int m = b.Length,
            n = c.Length;
        // Tableau rows 0..m-1: [A | I | b]; the objective row holds the reduced costs (negated) and −value.
        var t = new double[m + 1][];
        for (var i = 0; i < m; i++)
        {
            if (b[i] < 0)
            {
                throw new ArgumentException("b must be non-negative", nameof(b));
            }

            t[i] = new double[n + m + 1];
            Array.Copy(a[i], t[i], n);
            t[i][n + i] = 1;
            t[i][n + m] = b[i];
        }

        t[m] = new double[n + m + 1];
        for (var j = 0; j < n; j++)
        {
            t[m][j] = -c[j];
        }

        var basis = Enumerable.Range(n, m).ToArray();
        for (var iteration = 0; iteration < 50_000; iteration++)
        {
            var enter = -1;
            for (var j = 0; j < n + m && enter < 0; j++)
            {
                enter = t[m][j] < -Eps ? j : -1;
            }

            if (enter < 0)
            {
                return t[m][n + m];
            }

            var leave = -1;
            var best = double.PositiveInfinity;
            for (var i = 0; i < m; i++)
            {
                if (t[i][enter] > Eps)
                {
                    var ratio = t[i][n + m] / t[i][enter];
                    if (ratio < best - Eps || (Math.Abs(ratio - best) <= Eps && basis[i] < basis[leave]))
                    {
                        (best, leave) = (ratio, i);
                    }
                }
            }

            if (leave < 0)
            {
                return double.PositiveInfinity;
            }

            Pivot(t, leave, enter);
            basis[leave] = enter;
        }

        return double.NaN;
    }

    private static void Pivot(double[][] t, int row, int col)
    {
        var p = t[row][col];
        for (var j = 0; j < t[row].Length; j++)
        {
            t[row][j] /= p;
        }

        for (var i = 0; i < t.Length; i++)
        {
            var f = t[i][col];
            if (i == row || f == 0)
            {
                continue;
            }

            for (var j = 0; j < t[i].Length; j++)
            {
                t[i][j] -= f * t[row][j];
            }
        }
    }
}
