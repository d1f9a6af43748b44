namespace SortRig.Measurement.Drift;

/// <summary>
/// Drift (ppm/h) and tempco (ppm/K) of a logged resistance by least-squares regression (MathNet.Numerics).
/// Pure functions of the samples; no I/O.
/// </summary>
public static class DriftAnalysis
{
    /// <summary>Drift rate by a straight line of ppm against hours (MathNet Fit.Line).</summary>
    /// <param name="samples">At least 3 samples at two or more distinct times.</param>
    /// <param name="referenceOhms">Resistance the ppm refer to, ohms; default the mean of the samples.</param>
    public static DriftFit Drift(IReadOnlyList<DriftSample> samples, double? referenceOhms = null)
    {
        var series = DriftSeries.From(samples, referenceOhms, minimumCount: 3, needTemperature: false);
        DriftSeries.RequireSpread(series.Hours, "times", nameof(samples));
        (double intercept, Coefficient slope, double residual) = LeastSquares.Line(series.Hours, series.Ppm);
        return new DriftFit(
            slope,
            intercept,
            series.ReferenceOhms,
            series.Origin,
            series.Hours.Max(),
            residual,
            samples.Count
        );
    }

    /// <summary>Tempco by a straight line of ppm against temperature (MathNet Fit.Line); ignores time.</summary>
    /// <param name="samples">At least 3 samples, every one with a temperature, at two or more temperatures.</param>
    /// <param name="referenceOhms">Resistance the ppm refer to, ohms; default the mean of the samples.</param>
    public static TempcoFit Tempco(IReadOnlyList<DriftSample> samples, double? referenceOhms = null)
    {
        var series = DriftSeries.From(samples, referenceOhms, minimumCount: 3, needTemperature: true);
        DriftSeries.RequireSpread(series.TemperatureC, "temperatures", nameof(samples));
        double meanT = series.TemperatureC.Average();
        double[] dt = series.TemperatureC.Select(t => t - meanT).ToArray();
        (double intercept, Coefficient slope, double residual) = LeastSquares.Line(dt, series.Ppm);
        double span = series.TemperatureC.Max() - series.TemperatureC.Min();
        return new TempcoFit(slope, intercept, series.ReferenceOhms, meanT, span, residual, samples.Count);
    }

    /// <summary>
    /// <see cref="Joint"/>, or null with the reason its precondition failed (too few samples, a missing
    /// temperature, no spread, time and temperature collinear), for reports that show the reason instead.
    /// </summary>
    /// <param name="samples">The samples, as for <see cref="Joint"/>.</param>
    /// <param name="referenceOhms">Resistance the ppm refer to, ohms; default the mean of the samples.</param>
    /// <param name="reason">Why there is no fit; null when there is one.</param>
    public static DriftTempcoFit? TryJoint(
        IReadOnlyList<DriftSample> samples,
        double? referenceOhms,
        out string? reason
    )
    {
        try
        {
            reason = null;
            return Joint(samples, referenceOhms);
        }
        catch (ArgumentException e)
        {
            reason = e.Message.Split(" (Parameter", 2)[0];
            return null;
        }
    }

    /// <summary>
    /// Joint fit ppm ~ 1 + hours + (T - mean T) by MathNet multiple regression (QR), which separates
    /// a steady drift from a tempco when the temperature does not simply follow time.
    /// </summary>
    /// <param name="samples">At least 4 samples, every one with a temperature; time and temperature not
    /// collinear.</param>
    /// <param name="referenceOhms">Resistance the ppm refer to, ohms; default the mean of the samples.</param>
    public static DriftTempcoFit Joint(IReadOnlyList<DriftSample> samples, double? referenceOhms = null)
    {
        var series = DriftSeries.From(samples, referenceOhms, minimumCount: 4, needTemperature: true);
        DriftSeries.RequireSpread(series.Hours, "times", nameof(samples));
        DriftSeries.RequireSpread(series.TemperatureC, "temperatures", nameof(samples));
        double meanT = series.TemperatureC.Average();
        double[] dt = series.TemperatureC.Select(t => t - meanT).ToArray();
        double[] ones = Enumerable.Repeat(1.0, series.Hours.Length).ToArray();
        if (Math.Abs(Correlation(series.Hours, dt)) > 0.999999)
        {
            throw new ArgumentException(
                "Time and temperature are collinear in these samples, so drift and tempco cannot be separated; fit "
                    + "one of them alone.",
                nameof(samples)
            );
        }

        (Coefficient[] beta, double residual) = LeastSquares.Multiple([ones, series.Hours, dt], series.Ppm);
        return new DriftTempcoFit(
            beta[1],
            beta[2],
            beta[0].Value,
            series.ReferenceOhms,
            series.Origin,
            meanT,
            residual,
            samples.Count
        );
    }

    private static double Correlation(double[] x, double[] y) => MathNet.Numerics.Statistics.Correlation.Pearson(x, y);
}
