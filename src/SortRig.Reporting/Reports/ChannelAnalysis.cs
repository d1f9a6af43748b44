using SortRig.Measurement.Drift;

namespace SortRig.Reporting.Reports;

/// <summary>Drift, joint drift/tempco and ADEV of one channel (pure).</summary>
internal static class ChannelAnalysis
{
    public static ChannelSummary Analyze(
        string channel,
        IReadOnlyList<DriftSample> samples,
        string driftFile,
        string adevFile
    )
    {
        double reference = samples.Average(s => s.Ohms);
        double span = (samples[^1].Time - samples[0].Time).TotalHours;
        double[] intervals = samples.Zip(samples.Skip(1), (a, b) => (b.Time - a.Time).TotalSeconds).ToArray();
        double tau0 = intervals.Length == 0 ? double.NaN : MathNet.Numerics.Statistics.Statistics.Median(intervals);
        bool even = intervals.Length > 0 && tau0 > 0 && intervals.All(d => Math.Abs(d - tau0) <= 0.25 * tau0);

        DriftFit? drift = samples.Count >= 3 && span > 0 ? DriftAnalysis.Drift(samples, reference) : null;
        (DriftTempcoFit? joint, string? note) = TryJoint(samples, reference);
        IReadOnlyList<AllanPoint> adev =
            samples.Count >= 3 && tau0 > 0
                ? AllanDeviation.Overlapping(
                    AllanDeviation.FractionalDeviations(samples.Select(s => s.Ohms), reference),
                    tau0,
                    AllanDeviation.OctaveFactors(samples.Count)
                )
                : [];
        return new ChannelSummary(
            channel,
            samples.Count,
            reference,
            span,
            tau0,
            even,
            drift,
            joint,
            note,
            adev,
            driftFile,
            adev.Count > 0 ? adevFile : null
        );
    }

    private static (DriftTempcoFit? Fit, string? Note) TryJoint(IReadOnlyList<DriftSample> samples, double reference)
    {
        if (samples.Any(s => s.TemperatureC is null))
        {
            return (null, "no temperature logged");
        }

        var fit = DriftAnalysis.TryJoint(samples, reference, out var reason);
        return (fit, reason);
    }
}
