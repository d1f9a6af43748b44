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
}
