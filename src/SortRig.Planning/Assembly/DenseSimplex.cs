namespace SortRig.Planning.Assembly;

/// <summary>
/// A small dense tableau simplex (textbook) for max cᵀx subject to Ax ≤ b, x ≥ 0 with b ≥ 0, so the origin is
/// feasible: Dantzig's rule, Bland's (lowest index, which cannot cycle) after a run of degenerate pivots. Meant for
/// the tiny linear programmes of the bounds (tens to a few hundred rows and columns).
/// </summary>
internal static class DenseSimplex
{
    private const double Eps = 1e-10;

    /// <summary>Degenerate pivots in a row before Bland's rule takes over.</summary>
    private const int DegenerateRun = 50;

    /// <summary>The optimal objective value; +∞ when unbounded; NaN when the iteration cap is hit.</summary>
    public static double Maximize(double[] c, double[][] a, double[] b) => Solve(c, a, b, 50_000, stop: null).Value;

    /// <summary>
    /// Solves the programme. Value: the optimum, +∞ when unbounded, NaN when the cap or <paramref name="stop"/> (asked
    /// every 64 pivots) ended it. Duals (one per row, the objective row under the slack columns): only at the optimum.
    /// </summary>
    public static (double Value, double[]? Duals) Solve(
        double[] c,
        double[][] a,
        double[] b,
        int maxIterations,
        Func<bool>? stop
    )
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
        var degenerate = 0;
        for (var iteration = 0; iteration < maxIterations; iteration++)
        {
            if ((iteration & 63) == 0 && stop?.Invoke() == true)
            {
                return (double.NaN, null);
            }

            var enter = Entering(t[m], n + m, bland: degenerate > DegenerateRun);
            if (enter < 0)
            {
                return (t[m][n + m], [.. Enumerable.Range(0, m).Select(i => t[m][n + i])]);
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
                return (double.PositiveInfinity, null);
            }

            degenerate = best <= Eps ? degenerate + 1 : 0;
            Pivot(t, leave, enter);
            basis[leave] = enter;
        }

        return (double.NaN, null);
    }

    // Dantzig's rule (most negative reduced cost) or Bland's (the first negative one).
    private static int Entering(double[] objective, int columns, bool bland)
    {
        var enter = -1;
        var most = -Eps;
        for (var j = 0; j < columns; j++)
        {
            if (objective[j] < most)
            {
                if (bland)
                {
                    return j;
                }

                (enter, most) = (j, objective[j]);
            }
        }

        return enter;
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
