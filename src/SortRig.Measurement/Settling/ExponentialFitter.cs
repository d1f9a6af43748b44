using MathNet.Numerics.LinearAlgebra;

namespace SortRig.Measurement.Settling;

/// <summary>
/// Least-squares fits of y(t) = A + Σ B_j e^(−t/τ_j) (one or two exponentials) by variable projection (Golub and
/// Pereyra 1973): for given time constants the model is linear in A and the B_j, solved exactly; the residual sum
/// of squares is then minimised over ln τ by a grid and golden-section search. Pure computation.
/// </summary>
internal static partial class ExponentialFitter
{
    private static readonly double s_golden = (Math.Sqrt(5) - 1) / 2;

    /// <summary>Fits one exponential with τ in [tauMin, tauMax] seconds; tolerance is on ln τ.</summary>
    public static ExponentialFit One(
        ReadOnlySpan<double> t,
        ReadOnlySpan<double> y,
        double tauMin,
        double tauMax,
        double noiseFloorVariance,
        double tolerance = 1e-7
    )
    {
        double[] tt = t.ToArray(),
            yy = y.ToArray();
        double Rss(double u) => Project(tt, yy, [Math.Exp(u)], out _);
        var (lo, hi) = (Math.Log(tauMin), Math.Log(tauMax));
        var u = GridThenGolden(Rss, lo, hi, 24, tolerance);
        var tau = Math.Exp(u);
        var rss = Project(tt, yy, [tau], out var beta);
        // At the upper bound (the assumed longest time constant) the fit is still a valid, constrained one.
        var converged = u > lo + 1e-3;
        return Finish(RecoveryModel.OneExponential, tt, yy, beta, [tau], rss, noiseFloorVariance, converged);
    }

    /// <summary>Fits two exponentials, τ₁ &lt; τ₂/1.5, both in [tauMin, tauMax] seconds.</summary>
    public static ExponentialFit Two(
        ReadOnlySpan<double> t,
        ReadOnlySpan<double> y,
        double tauMin,
        double tauMax,
        double noiseFloorVariance,
        double tolerance = 1e-5
    )
    {
        double[] tt = t.ToArray(),
            yy = y.ToArray();
        var (lo, hi) = (Math.Log(tauMin), Math.Log(tauMax));
        var gap = Math.Log(1.5);
        double Rss(double u1, double u2) =>
            u2 - u1 < gap || u1 < lo || u2 > hi
                ? double.PositiveInfinity
                : Project(tt, yy, [Math.Exp(u1), Math.Exp(u2)], out _);

        // Coarse grid over the ordered pairs, then alternating golden-section refinement of each coordinate.
        const int Grid = 12;
        var step = (hi - lo) / (Grid - 1);
        var (b1, b2, best) = (lo, hi, double.PositiveInfinity);
        for (var i = 0; i < Grid; i++)
        {
            for (var j = i + 1; j < Grid; j++)
            {
                var r = Rss(lo + (i * step), lo + (j * step));
                if (r < best)
                {
                    (b1, b2, best) = (lo + (i * step), lo + (j * step), r);
                }
            }
        }

        (b1, b2) = NelderMead2.Minimum(Rss, b1, b2, step / 2, tolerance, 400);

        double[] taus = [Math.Exp(b1), Math.Exp(b2)];
        var rss = Project(tt, yy, taus, out var beta);
        var converged = double.IsFinite(rss) && b1 > lo + 1e-3 && b2 - b1 > gap + 1e-3;
        return Finish(RecoveryModel.TwoExponentials, tt, yy, beta, taus, rss, noiseFloorVariance, converged);
    }

    /// <summary>
    /// The linear step: least squares of y on [1, e^(−t/τ_1), ...]; returns the RSS (∞ when singular) and the
    /// coefficients (A, B_1, ...).
    /// </summary>
    internal static double Project(double[] t, double[] y, double[] taus, out double[] beta)
    {
        var m = taus.Length + 1;
        Span<double> g = stackalloc double[m * m];
        Span<double> h = stackalloc double[m];
        Span<double> row = stackalloc double[m];
        for (var i = 0; i < t.Length; i++)
        {
            row[0] = 1;
            for (var j = 1; j < m; j++)
            {
                row[j] = Math.Exp(-t[i] / taus[j - 1]);
            }

            for (var a = 0; a < m; a++)
            {
                h[a] += row[a] * y[i];
                for (var b = a; b < m; b++)
                {
                    g[(a * m) + b] += row[a] * row[b];
                }
            }
        }

        for (var a = 0; a < m; a++)
        {
            for (var b = 0; b < a; b++)
            {
                g[(a * m) + b] = g[(b * m) + a];
            }
        }

        beta = new double[m];
        Span<double> rhs = stackalloc double[m];
        h.CopyTo(rhs);
        if (!Solve(g, rhs, beta, m))
        {
            return double.PositiveInfinity;
        }

        // The residual sum directly (not yy − βᵀh, which cancels badly near a perfect fit).
        double rss = 0;
        for (var i = 0; i < t.Length; i++)
        {
            var r = y[i] - beta[0];
            for (var j = 1; j < m; j++)
            {
                r -= beta[j] * Math.Exp(-t[i] / taus[j - 1]);
            }

            rss += r * r;
        }

        return rss;
    }

    private static ExponentialFit Finish(
        RecoveryModel model,
        double[] t,
        double[] y,
        double[] beta,
        double[] taus,
        double rss,
        double floor,
        bool converged
    )
    {
        var n = t.Length;
        var p = 1 + (2 * taus.Length);
        var s2 = Math.Max(n > p ? rss / (n - p) : 0, floor);
        var amplitudes = beta[1..];
        var variance = double.PositiveInfinity;
        var slowVariance = double.PositiveInfinity;
        if (n >= p && double.IsFinite(rss))
        {
            // Jacobian columns: ∂/∂A = 1, ∂/∂B_j = e^(−t/τ_j), ∂/∂τ_j = B_j t/τ_j² e^(−t/τ_j).
            var jtj = Matrix<double>.Build.Dense(p, p);
            var row = new double[p];
            for (var i = 0; i < n; i++)
            {
                row[0] = 1;
                for (var j = 0; j < taus.Length; j++)
                {
                    var e = Math.Exp(-t[i] / taus[j]);
                    row[1 + (2 * j)] = e;
                    row[2 + (2 * j)] = amplitudes[j] * t[i] / (taus[j] * taus[j]) * e;
                }

                for (var a = 0; a < p; a++)
                {
                    for (var b = 0; b < p; b++)
                    {
                        jtj[a, b] += row[a] * row[b];
                    }
                }
            }

            var inverse = jtj.Inverse();
            var c = inverse[0, 0];
            var conditioned = jtj.ConditionNumber() < 1e14;
            variance = double.IsFinite(c) && c > 0 && conditioned ? s2 * c : double.PositiveInfinity;
            var slow = Array.IndexOf(taus, taus.Max());
            var cs = inverse[2 + (2 * slow), 2 + (2 * slow)];
            slowVariance = double.IsFinite(cs) && cs > 0 && conditioned ? s2 * cs : double.PositiveInfinity;
        }

        return new ExponentialFit(
            model,
            beta[0],
            variance,
            amplitudes,
            taus,
            rss,
            n,
            converged && double.IsFinite(variance)
        )
        {
            VarianceOfSlowest = slowVariance,
        };
    }

    private static double GridThenGolden(Func<double, double> f, double lo, double hi, int grid, double tolerance)
    {
        var step = (hi - lo) / (grid - 1);
        var (bestU, best) = (lo, double.PositiveInfinity);
        for (var i = 0; i < grid; i++)
        {
            var r = f(lo + (i * step));
            if (r < best)
            {
                (bestU, best) = (lo + (i * step), r);
            }
        }

        return Golden(f, Math.Max(lo, bestU - step), Math.Min(hi, bestU + step), tolerance);
    }

    /// <summary>Golden-section search for a minimum in [a, b] down to a bracket of the given width (Kiefer
    /// 1953).</summary>
    private static double Golden(Func<double, double> f, double a, double b, double tolerance)
    {
        if (!(b > a))
        {
            return a;
        }

        var c = b - (s_golden * (b - a));
        var d = a + (s_golden * (b - a));
        var (fc, fd) = (f(c), f(d));
        while (b - a > tolerance)
        {
            if (fc <= fd)
            {
                (b, d, fd) = (d, c, fc);
                c = b - (s_golden * (b - a));
                fc = f(c);
            }
            else
            {
                (a, c, fc) = (c, d, fd);
                d = a + (s_golden * (b - a));
                fd = f(d);
            }
        }

        return (a + b) / 2;
    }

    /// <summary>Gaussian elimination with partial pivoting on a small m × m system; false when singular.</summary>
    internal static bool Solve(Span<double> g, Span<double> h, double[] x, int m)
    {
        var scale = 0.0;
        for (var i = 0; i < m; i++)
        {
            scale = Math.Max(scale, Math.Abs(g[(i * m) + i]));
        }

        for (var col = 0; col < m; col++)
        {
            var pivot = col;
            for (var r = col + 1; r < m; r++)
            {
                if (Math.Abs(g[(r * m) + col]) > Math.Abs(g[(pivot * m) + col]))
                {
                    pivot = r;
                }
            }

            if (!(Math.Abs(g[(pivot * m) + col]) > 1e-13 * scale))
            {
                return false;
            }

            if (pivot != col)
            {
                for (var k = 0; k < m; k++)
                {
                    (g[(col * m) + k], g[(pivot * m) + k]) = (g[(pivot * m) + k], g[(col * m) + k]);
                }

                (h[col], h[pivot]) = (h[pivot], h[col]);
            }

            for (var r = col + 1; r < m; r++)
            {
                var factor = g[(r * m) + col] / g[(col * m) + col];
                for (var k = col; k < m; k++)
                {
                    g[(r * m) + k] -= factor * g[(col * m) + k];
                }

                h[r] -= factor * h[col];
            }
        }

        for (var r = m - 1; r >= 0; r--)
        {
            var sum = h[r];
            for (var k = r + 1; k < m; k++)
            {
                sum -= g[(r * m) + k] * x[k];
            }

            x[r] = sum / g[(r * m) + r];
        }

        return true;
    }
}
