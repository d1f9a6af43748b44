using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Settling;

/// <summary>
/// Profile-likelihood interval of the asymptote A (Venzon and Moolgavkar 1988; Bates and Watts 1988 ch. 6, from
/// memory): the set of A whose least residual sum, over every other parameter, exceeds the minimum by at most
/// χ²₁ s² (see <see cref="ChiSquareThreshold"/>). The model is conditionally linear (Bates and Watts 1988 sec. 3.5.5,
/// from memory): at given time constants the residual sum is RSS(τ) + (A − Â(τ))² / c(τ), c(τ) the (A, A) element of
/// (XᵀX)⁻¹, so the profile interval is the union over a grid of time constants of
/// Â(τ) ± √((threshold − RSS(τ)) c(τ)). Profiling A itself, not the slowest time constant, matters: on a short
/// record of a two-path recovery a slow path of almost any size fits as well as none, and only a profile over A
/// sees that the asymptote is then not pinned.
/// </summary>
internal static partial class ExponentialFitter
{
    /// <summary>
    /// χ²₁ at 1 − 0.05/20 (<see cref="DefaultLooks"/> looks): each look's interval is widened by Bonferroni's
    /// correction to keep 95 % coverage over the looks (z = 3.02).
    /// </summary>
    public const double ChiSquareThreshold = 9.141;

    /// <summary>√<see cref="ChiSquareThreshold"/>: the matching multiple of a linearised standard
    /// uncertainty.</summary>
    public const double Z = 3.0234;

    /// <summary>
    /// The small-sample form of <see cref="ChiSquareThreshold"/>: F(1, ν) = t²_ν at the same level, ν = n − p residual
    /// degrees of freedom (s² is itself estimated; Bates and Watts 1988 sec. 6.1, from memory). Tends to 9.14 for
    /// large ν; 16.0 for ν = 7 (twelve readings, two exponentials).
    /// </summary>
    public static double Threshold(int degreesOfFreedom, double looks = DefaultLooks) =>
        degreesOfFreedom <= 0
            ? double.PositiveInfinity
            : Math.Pow(StudentT.InvCDF(0, 1, degreesOfFreedom, 1 - (0.05 / (2 * Math.Max(1, looks)))), 2);

    /// <summary>
    /// Looks over which the Bonferroni correction spreads the 5 %: 20, the looks the predictive rule takes in one
    /// assumed longest time constant (5 s) at its fit interval (0.25 s), when readings come faster than that.
    /// </summary>
    public const double DefaultLooks = 20;

    /// <summary>Grid step of the time constants in ln τ.</summary>
    private const double GridStep = 0.1;

    /// <summary>
    /// The profile interval of A (lowest, highest), at the Bonferroni-corrected level, under the model of
    /// <paramref name="best"/> (one or two exponentials, τ₁ &lt; τ₂/1.5). Time constants are searched within
    /// [tauMin, tauMax]: the upper bound is the physical assumption that no part recovers more slowly
    /// (SettleOptions.AssumedTimeConstant). Infinite when the record cannot bound A.
    /// </summary>
    public static (double Low, double High) ProfileInterval(
        ReadOnlySpan<double> t,
        ReadOnlySpan<double> y,
        ExponentialFit best,
        double s2,
        double tauMin,
        double tauMax,
        bool sameSign = true,
        double looks = DefaultLooks
    )
    {
        var n = t.Length;
        var taus = new List<double>(best.TimeConstants);
        for (var u = Math.Log(tauMin); u < Math.Log(tauMax); u += GridStep)
        {
            taus.Add(Math.Exp(u));
        }

        taus.Add(tauMax);
        var (meanY, yc, syy) = Centred(y[..n]);

        // Centred columns e^(−t/τ) − mean: the intercept is solved apart, which keeps the small systems well
        // conditioned.
        var centred = Columns(t, yc, taus);
        var columns = centred.Select(c => c.Column).ToArray();
        var means = centred.Select(c => c.Mean).ToArray();
        var cross = centred.Select(c => c.Cross).ToArray();
        var squares = centred.Select(c => c.Squares).ToArray();

        // One exponential at each grid time constant; for two exponentials these are the boundary B₂ = 0.
        var points = new List<(double Rss, double A, double C)>();
        for (var k = 0; k < taus.Count; k++)
        {
            if (squares[k] > 0)
            {
                var b = cross[k] / squares[k];
                var c = (1.0 / n) + (means[k] * means[k] / squares[k]);
                points.Add((syy - (b * cross[k]), meanY - (b * means[k]), c));
            }
        }

        if (best.Model == RecoveryModel.TwoExponentials)
        {
            var minRatio = 1.5 * (1 - 1e-9);
            for (var k = 0; k < taus.Count; k++)
            {
                for (var l = 0; l < taus.Count; l++)
                {
                    if (taus[l] < taus[k] * minRatio)
                    {
                        continue;
                    }

                    double m12 = 0;
                    var (ck, cl) = (columns[k], columns[l]);
                    for (var i = 0; i < n; i++)
                    {
                        m12 += ck[i] * cl[i];
                    }

                    var (m11, m22) = (squares[k], squares[l]);
                    var det = (m11 * m22) - (m12 * m12);
                    if (!(det > 1e-13 * m11 * m22))
                    {
                        // The two columns are one to working precision: A is not bounded by this pair.
                        points.Add((syy - (cross[k] * cross[k] / m11), double.NaN, double.PositiveInfinity));
                        continue;
                    }

                    var b1 = ((m22 * cross[k]) - (m12 * cross[l])) / det;
                    var b2 = ((m11 * cross[l]) - (m12 * cross[k])) / det;
                    if (sameSign && b1 * b2 < 0)
                    {
                        // Both paths carry the same handling warmth: terms of opposite sign are not a cooling part.
                        // The constrained optimum then lies on the boundary, one exponential, held above.
                        continue;
                    }

                    var (g1, g2) = (means[k], means[l]);
                    var c = (1.0 / n) + (((m22 * g1 * g1) - (2 * m12 * g1 * g2) + (m11 * g2 * g2)) / det);
                    points.Add((syy - (b1 * cross[k]) - (b2 * cross[l]), meanY - (b1 * g1) - (b2 * g2), c));
                }
            }
        }

        if (points.Count == 0)
        {
            return (double.NegativeInfinity, double.PositiveInfinity);
        }

        var parameters = best.Model == RecoveryModel.TwoExponentials ? 5 : 3;
        var threshold = Math.Min(best.Rss, points.Min(q => q.Rss)) + (Threshold(n - parameters, looks) * s2);
        var (low, high) = (best.Final, best.Final);
        foreach (var (rss, a, c) in points)
        {
            var room = threshold - Math.Max(rss, 0);
            if (room < 0)
            {
                continue;
            }

            if (!double.IsFinite(c) || !double.IsFinite(a))
            {
                return (double.NegativeInfinity, double.PositiveInfinity);
            }

            var half = Math.Sqrt(room * c);
            (low, high) = (Math.Min(low, a - half), Math.Max(high, a + half));
        }

        return (low, high);
    }
}
