namespace SortRig.Storage.Contracts;

/// <summary>One drift run a library part was logged in: the run, the channel it sat on and what that channel
/// holds.</summary>
/// <param name="PartId">Library part on the channel.</param>
/// <param name="RunId">Drift run id.</param>
/// <param name="RunName">Run name.</param>
/// <param name="RunStartedAt">When the run was started (UTC); runs are ordered by this, then by id.</param>
/// <param name="Channel">Channel number in the run, 0..channels-1.</param>
/// <param name="ChannelLabel">Channel label (e.g. "ch101").</param>
/// <param name="FirstSampleAt">Time of the channel's earliest sample (UTC, 1 µs); null when it has none.</param>
/// <param name="LastSampleAt">Time of the channel's latest sample (UTC, 1 µs); null when it has none.</param>
/// <param name="SampleCount">Samples stored for the channel, &gt;= 0.</param>
public sealed record PartDriftRun(
    long PartId,
    long RunId,
    string RunName,
    DateTimeOffset RunStartedAt,
    int Channel,
    string ChannelLabel,
    DateTimeOffset? FirstSampleAt,
    DateTimeOffset? LastSampleAt,
    long SampleCount
)
{
    /// <summary>Time between the first and last sample, hours; 0 with fewer than two samples.</summary>
    public double HoursLogged => FirstSampleAt is { } first && LastSampleAt is { } last ? (last - first).TotalHours : 0;
}
