using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using SortRig.Measurement.Readings;

namespace SortRig.Measurement.Settling;

/// <summary>
/// Least-squares line through a window of readings (value against seconds) with the t statistic of its slope,
/// and the standard error of the window mean.
/// </summary>
/// <param name="Mean">Mean value, ohms.</param>
/// <param name="Slope">Regression slope, ohms per second.</param>
/// <param name="SlopeSignificant">True when the two-sided t test rejects slope = 0 at the level used.</param>
/// <param name="Duration">Time from the first to the last reading of the window, seconds.</param>
/// <param name="Sem">s/√n of the window values, ohms.</param>
/// <param name="SlopeStandardError">SE(b) = √(SSR/(n−2)/Sxx), ohms per second.</param>
/// <param name="Sxx">Σ(t − t̄)² of the reading times, s².</param>
internal readonly record struct WindowStatistics(
    double Mean,
    double Slope,
    bool SlopeSignificant,
    double Duration,
    double Sem,
    double SlopeStandardError,
    double Sxx
)
{
    /// <summary>|slope| × window duration, ohms: how far the value moved across the window.</summary>
    public double Excursion => Math.Abs(Slope) * Duration;

    /// <summary>The two-sided critical t for n − 2 degrees of freedom at level alpha.</summary>
    public static double CriticalT(int n, double alpha) => StudentT.InvCDF(0, 1, n - 2, 1 - (alpha / 2));

    /// <summary>Statistics of the window, or null when its times do not spread (all equal) or n &lt; 3.</summary>
    public static WindowStatistics? Of(IReadOnlyList<Reading> window, double criticalT)
    {
        var n = window.Count;
        if (n < 3)
        {
            return null;
        }

        var t0 = window[0].Time;
        var v0 = window[0].Value;
        var x = new double[n];
        var y = new double[n];
        for (var i = 0; i < n; i++)
        {
            x[i] = (window[i].Time - t0).TotalSeconds;
            y[i] = window[i].Value - v0; // offsets keep the fit well conditioned
        }

        var duration = x[n - 1];
        if (!(duration > 0))
        {
            return null;
        }

        var (intercept, slope) = Fit.Line(x, y);
        var xMean = x.Average();
        double sxx = 0,
            ssr = 0;
        for (var i = 0; i < n; i++)
        {
            var dx = x[i] - xMean;
            sxx += dx * dx;
            var r = y[i] - intercept - (slope * x[i]);
            ssr += r * r;
        }

        var seSlope = Math.Sqrt(ssr / (n - 2) / sxx);
        var significant = seSlope > 0 ? Math.Abs(slope / seSlope) > criticalT : slope != 0;
        var (meanOffset, variance) = MathNet.Numerics.Statistics.ArrayStatistics.MeanVariance(y);
        return new WindowStatistics(
            v0 + meanOffset,
            slope,
            significant,
            duration,
            Math.Sqrt(variance / n),
            seSlope,
            sxx
        );
    }
}
