using SortRig.Engine.DriftLogging;
using SortRig.Measurement.Drift;
using SortRig.Storage.Contracts;

namespace SortRig.Host.LibraryVerb;

/// <summary>
/// The latest drift record of library parts: which run each part was last logged in (storage), and what the run's
/// analysis shows for the part's channel (<see cref="DriftRunAnalysis.Analyze"/>, i.e. SortRig.Measurement.Drift).
/// </summary>
internal static class LibraryDrift
{
    /// <summary>
    /// Smallest equivalent degrees of freedom (white frequency noise, NIST SP 1065) of an Allan point reported as
    /// reliable. At 10 the 68 % chi-square interval of sigma is about -16 % / +33 %; the threshold is our choice, no
    /// source.
    /// </summary>
    public const double ReliableEdf = 10;

    /// <summary>Above this many parts every drift record is read and filtered here, instead of binding the
    /// ids.</summary>
    private const int MaxIdsBound = 10_000;

    /// <summary>Each part's latest run with samples (by run start, then run id); parts never logged are absent.
    /// Reads each run needed once, keeping only the channels of the given parts.</summary>
    public static async Task<IReadOnlyDictionary<long, PartDrift>> LatestAsync(
        IDriftLog log,
        IReadOnlyList<PartRecord> parts,
        CancellationToken cancellationToken
    )
    {
        var wanted = parts.Select(p => p.Id).ToHashSet();
        if (wanted.Count == 0)
        {
            return new Dictionary<long, PartDrift>();
        }

        var rows = await log.GetPartDriftRunsAsync(wanted.Count <= MaxIdsBound ? [.. wanted] : null, cancellationToken)
            .ConfigureAwait(false);
        var latest = rows.Where(r => r.SampleCount > 0 && wanted.Contains(r.PartId))
            .GroupBy(r => r.PartId)
            .Select(g => g.MaxBy(r => (r.RunStartedAt, r.RunId, r.Channel))!)
            .ToList();
        var result = new Dictionary<long, PartDrift>();
        foreach (var run in latest.GroupBy(r => r.RunId))
        {
            var stored = await log.GetDriftRunAsync(run.Key, cancellationToken).ConfigureAwait(false);
            if (stored is null)
            {
                continue; // cannot happen: runs are never deleted
            }

            var byChannel = run.Select(r => r.Channel).Distinct().ToDictionary(c => c, _ => new List<DriftSample>());
            await foreach (var s in log.ReadDriftSamplesAsync(run.Key, cancellationToken).ConfigureAwait(false))
            {
                if (byChannel.TryGetValue(s.Channel, out var samples))
                {
                    samples.Add(new DriftSample(s.Time, s.Ohms, s.Temperature));
                }
            }

            foreach (var r in run)
            {
                result[r.PartId] = PartDrift.From(
                    r,
                    DriftRunAnalysis.Analyze(r.ChannelLabel, byChannel[r.Channel], stored.Interval)
                );
            }
        }

        return result;
    }
}
