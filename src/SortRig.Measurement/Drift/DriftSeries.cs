namespace SortRig.Measurement.Drift;

/// <summary>Validated samples as regression columns: hours since origin, ppm of reference, degC.</summary>
internal sealed record DriftSeries(
    double[] Hours,
    double[] Ppm,
    double[] TemperatureC,
    double ReferenceOhms,
    DateTimeOffset Origin
)
{
    public static DriftSeries From(
        IReadOnlyList<DriftSample> samples,
        double? referenceOhms,
        int minimumCount,
        bool needTemperature
    )
    {
        ArgumentNullException.ThrowIfNull(samples);
        if (samples.Count < minimumCount)
        {
            throw new ArgumentException(
                $"At least {minimumCount} samples are needed for this fit; got {samples.Count}.",
                nameof(samples)
            );
        }

        for (int i = 0; i < samples.Count; i++)
        {
            DriftSample s = samples[i];
            if (!double.IsFinite(s.Ohms) || s.Ohms <= 0)
            {
                throw new ArgumentException(
                    $"samples[{i}].Ohms must be a finite resistance > 0 ohm; got {s.Ohms}.",
                    nameof(samples)
                );
            }

            if (needTemperature && (s.TemperatureC is not { } t || !double.IsFinite(t)))
            {
                throw new ArgumentException(
                    $"samples[{i}].TemperatureC must be a finite temperature in degC for a tempco fit; got "
                        + $"{s.TemperatureC?.ToString() ?? "null"}.",
                    nameof(samples)
                );
            }
        }

        double reference = referenceOhms ?? samples.Average(s => s.Ohms);
        if (!double.IsFinite(reference) || reference <= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(referenceOhms),
                referenceOhms,
                "Reference resistance must be finite and > 0 ohm."
            );
        }

        DateTimeOffset origin = samples.Min(s => s.Time);
        double[] hours = samples.Select(s => (s.Time - origin).TotalHours).ToArray();
        double[] ppm = samples.Select(s => ((s.Ohms / reference) - 1.0) * 1e6).ToArray();
        double[] temperature = samples.Select(s => s.TemperatureC ?? double.NaN).ToArray();
        return new DriftSeries(hours, ppm, temperature, reference, origin);
    }

    public static void RequireSpread(double[] values, string what, string paramName)
    {
        if (values.Max() - values.Min() <= 0)
        {
            throw new ArgumentException(
                $"The samples' {what} do not vary, so no slope against them can be fitted.",
                paramName
            );
        }
    }
}
