using SortRig.Measurement.Drift;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// Drift (ppm/h), tempco (ppm/K) and overlapping Allan deviation of each part channel of a stored run,
/// read back from the log (SortRig.Measurement.Drift does the arithmetic).
/// </summary>
public static class DriftRunAnalysis
{
    /// <summary>Reads the run's samples and analyses each channel. Memory grows with the samples of the run.</summary>
    /// <param name="log">The precision log.</param>
    /// <param name="runId">Drift run id.</param>
    /// <param name="ct">Caller cancellation.</param>
    /// <exception cref="ArgumentException">No run has this id.</exception>
    public static async Task<IReadOnlyList<DriftChannelResult>> AnalyzeAsync(
        IDriftLog log,
        long runId,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(log);
        var run = await log.GetDriftRunAsync(runId, ct).ConfigureAwait(false)
            ?? throw new ArgumentException($"No drift run with id {runId}.", nameof(runId));
        var byChannel = run.Channels.Select(_ => new List<DriftSample>()).ToArray();
        await foreach (StoredDriftSample s in log.ReadDriftSamplesAsync(runId, ct).ConfigureAwait(false))
        {
            byChannel[s.Channel].Add(new DriftSample(s.Time, s.Ohms, s.Temperature));
        }

        return [.. run.Channels.Select((c, i) => Analyze(c.Label, byChannel[i], run.Interval))];
    }

    /// <summary>Analyses one channel's samples (ordered by time); the Pt100 channel gets its count and mean
    /// only.</summary>
    public static DriftChannelResult Analyze(string label, IReadOnlyList<DriftSample> samples, TimeSpan interval)
    {
        ArgumentNullException.ThrowIfNull(samples);
        if (samples.Count == 0)
        {
            return new DriftChannelResult(label, 0, double.NaN, null, null, "no samples", []);
        }

        var mean = samples.Average(s => s.Ohms);
        if (DriftSettings.IsPt100Label(label))
        {
            return new DriftChannelResult(label, samples.Count, mean, null, null, "thermometer channel", []);
        }

        var spread = samples.Count >= 3 && samples[^1].Time > samples[0].Time;
        var drift = spread ? DriftAnalysis.Drift(samples, mean) : null;
        (DriftTempcoFit? joint, string? note) = Joint(samples, mean);
        var adev =
            samples.Count >= 3
                ? AllanDeviation.Overlapping(
                    AllanDeviation.FractionalDeviations(samples.Select(s => s.Ohms), mean),
                    interval.TotalSeconds,
                    AllanDeviation.OctaveFactors(samples.Count)
                )
                : [];
        return new DriftChannelResult(label, samples.Count, mean, drift, joint, note, adev);
    }

    private static (DriftTempcoFit? Fit, string? Note) Joint(IReadOnlyList<DriftSample> samples, double mean)
    {
        if (samples.Any(s => s.TemperatureC is null))
        {
            return (null, "some samples have no temperature");
        }

        var fit = DriftAnalysis.TryJoint(samples, mean, out var reason);
        return (fit, reason);
    }
}
