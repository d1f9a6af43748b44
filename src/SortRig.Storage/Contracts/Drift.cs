namespace SortRig.Storage.Contracts;

/// <summary>What the host asks for when it starts an overnight drift log.</summary>
/// <param name="Name">Run name, 1..200 characters.</param>
/// <param name="Channels">Channels logged, numbered 0..n-1 in this order; at least one.</param>
/// <param name="Interval">Intended sampling interval, &gt; 0.</param>
/// <param name="Notes">Free text, optional.</param>
public sealed record DriftRunRequest(
    string Name,
    IReadOnlyList<DriftChannel> Channels,
    TimeSpan Interval,
    string? Notes = null
);

/// <summary>One logged channel.</summary>
/// <param name="Label">Channel label (e.g. the scanner position), non-empty.</param>
/// <param name="PartId">Library part on the channel, optional; must exist when given.</param>
public sealed record DriftChannel(string Label, long? PartId = null);

/// <summary>A drift run as stored.</summary>
/// <param name="Id">Database id.</param>
/// <param name="Name">Run name.</param>
/// <param name="StartedAt">When the run was started (UTC, from the log's TimeProvider).</param>
/// <param name="Interval">Intended sampling interval (microsecond resolution).</param>
/// <param name="Channels">Channels by number.</param>
/// <param name="Notes">Free text.</param>
public sealed record DriftRun(
    long Id,
    string Name,
    DateTimeOffset StartedAt,
    TimeSpan Interval,
    IReadOnlyList<DriftChannel> Channels,
    string? Notes
);

/// <summary>One drift sample. A sample with the same run, channel and time as a stored one is ignored on
/// append.</summary>
/// <param name="RunId">Drift run.</param>
/// <param name="Channel">Channel number, 0..channels-1.</param>
/// <param name="Time">When it was taken (UTC, microsecond resolution).</param>
/// <param name="Ohms">Value, ohms.</param>
/// <param name="Temperature">degC, optional.</param>
public readonly record struct StoredDriftSample(
    long RunId,
    int Channel,
    DateTimeOffset Time,
    double Ohms,
    double? Temperature
);

/// <summary>A stretch of a drift run with no valid samples.</summary>
/// <param name="RunId">Drift run.</param>
/// <param name="From">Start of the gap.</param>
/// <param name="To">End of the gap, &gt;= From.</param>
/// <param name="Reason">Why (e.g. "meter lost connection"), non-empty.</param>
public sealed record DriftGap(long RunId, DateTimeOffset From, DateTimeOffset To, string Reason);
