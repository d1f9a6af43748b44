namespace SortRig.Measurement.Settling;

/// <summary>The centred least-squares pieces the profile intervals share: the intercept is solved apart, which keeps
/// the small systems well conditioned.</summary>
internal static partial class ExponentialFitter
{
    /// <summary>The readings' mean, the readings less it, and their sum of squares.</summary>
    private static (double Mean, double[] Centred, double Squares) Centred(ReadOnlySpan<double> y)
    {
        var n = y.Length;
        var mean = 0.0;
        for (var i = 0; i < n; i++)
        {
            mean += y[i];
        }

        mean /= n;
        var centred = new double[n];
        var squares = 0.0;
        for (var i = 0; i < n; i++)
        {
            centred[i] = y[i] - mean;
            squares += centred[i] * centred[i];
        }

        return (mean, centred, squares);
    }

    /// <summary>Centred columns e^(−t/τ) − mean, with their mean, cross product with the centred y and sum of
    /// squares.</summary>
    private static (double[] Column, double Mean, double Cross, double Squares)[] Columns(
        ReadOnlySpan<double> t,
        double[] yc,
        List<double> taus
    )
    {
        var n = t.Length;
        var result = new (double[], double, double, double)[taus.Count];
        for (var k = 0; k < taus.Count; k++)
        {
            var column = new double[n];
            var mean = 0.0;
            for (var i = 0; i < n; i++)
            {
                column[i] = Math.Exp(-t[i] / taus[k]);
                mean += column[i];
            }

            mean /= n;
            double sxy = 0,
                sxx = 0;
            for (var i = 0; i < n; i++)
            {
                column[i] -= mean;
                sxy += column[i] * yc[i];
                sxx += column[i] * column[i];
            }

            result[k] = (column, mean, sxy, sxx);
        }

        return result;
    }

    /// <summary>The profile's points at one body time constant, as (RSS, unclamped; asymptote; variance factor of the
    /// asymptote): the lead path carrying nothing (one exponential at the body's time constant), then each lead at
    /// least 1.5 times faster than the body whose two-path least squares keeps both amplitudes of one sign.</summary>
    private static IEnumerable<(double Rss, double A, double C)> BodyProfile(
        int n,
        double meanY,
        double syy,
        (double[] Column, double Mean, double Cross, double Squares) bodyColumn,
        (double[] Column, double Mean, double Cross, double Squares)[] lead,
        List<double> leads,
        double bodyTau
    )
    {
        var (cl, gl, hl, ml) = bodyColumn;
        var b = hl / ml;
        yield return (syy - (b * hl), meanY - (b * gl), (1.0 / n) + (gl * gl / ml));
        for (var k = 0; k < leads.Count && leads[k] * 1.5 <= bodyTau * (1 + 1e-9); k++)
        {
            var (ck, gk, hk, mk) = lead[k];
            double m12 = 0;
            for (var i = 0; i < n; i++)
            {
                m12 += ck[i] * cl[i];
            }

            var det = (mk * ml) - (m12 * m12);
            if (!(det > 1e-13 * mk * ml))
            {
                continue;
            }

            var b1 = ((ml * hk) - (m12 * hl)) / det;
            var b2 = ((mk * hl) - (m12 * hk)) / det;
            if (b1 * b2 < 0)
            {
                // Opposite signs are not a cooling part; the constrained optimum is the boundary B_lead = 0 above.
                continue;
            }

            var c = (1.0 / n) + (((ml * gk * gk) - (2 * m12 * gk * gl) + (mk * gl * gl)) / det);
            yield return (syy - (b1 * hk) - (b2 * hl), meanY - (b1 * gk) - (b2 * gl), c);
        }
    }
}
