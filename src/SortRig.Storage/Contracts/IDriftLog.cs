namespace SortRig.Storage.Contracts;

/// <summary>Drift logging: runs, samples, gaps, and which runs each library part was logged in. One role of <see
/// cref="IPrecisionLog"/>; the same transaction, fault and argument rules.</summary>
public interface IDriftLog
{
    /// <summary>Starts a drift run.</summary>
    Task<DriftRun> StartDriftRunAsync(DriftRunRequest request, CancellationToken cancellationToken);

    /// <summary>Appends samples in one transaction (batched inserts); duplicates of stored samples are ignored.
    /// Returns how many were new.</summary>
    Task<int> AppendDriftSamplesAsync(IReadOnlyList<StoredDriftSample> samples, CancellationToken cancellationToken);

    /// <summary>Records a gap in a drift run.</summary>
    Task MarkGapAsync(DriftGap gap, CancellationToken cancellationToken);

    /// <summary>A drift run, or null when no run has this id.</summary>
    Task<DriftRun?> GetDriftRunAsync(long runId, CancellationToken cancellationToken);

    /// <summary>Streams the samples of a run ordered by time then channel, in constant memory.</summary>
    IAsyncEnumerable<StoredDriftSample> ReadDriftSamplesAsync(long runId, CancellationToken cancellationToken);

    /// <summary>
    /// The drift runs each library part was logged in (one row per run and channel the part sat on), ordered by part
    /// id, then run start, run id and channel. Parts never put on a drift channel have no rows.
    /// </summary>
    /// <param name="partIds">Parts to look up (any number, ids &gt; 0); null for every part on any drift
    /// channel.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    Task<IReadOnlyList<PartDriftRun>> GetPartDriftRunsAsync(
        IReadOnlyList<long>? partIds,
        CancellationToken cancellationToken
    );

    /// <summary>Gaps of a run ordered by start.</summary>
    Task<IReadOnlyList<DriftGap>> GetDriftGapsAsync(long runId, CancellationToken cancellationToken);
}
