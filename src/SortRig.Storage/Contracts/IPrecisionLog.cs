namespace SortRig.Storage.Contracts;

/// <summary>
/// The durable precision log: sessions, batches, parts with their raw readings, the part library and drift logs.
/// Every write is one transaction, committed durably before the method returns. Faults of the store surface as
/// <see cref="StorageException"/>; caller cancellation as <see cref="OperationCanceledException"/>.
/// Bad arguments throw <see cref="ArgumentException"/> naming the field. Safe to call from several threads.
/// </summary>
public interface IPrecisionLog : IAsyncDisposable
{
    /// <summary>Engine behind this log.</summary>
    StorageEngine Engine { get; }

    /// <summary>Resumes the latest unfinished session with the request's name (unless told not to) or starts a new one.</summary>
    Task<SessionState> OpenOrResumeSessionAsync(SessionRequest request, CancellationToken cancellationToken);

    /// <summary>Starts a batch in an open session.</summary>
    Task<BatchInfo> StartBatchAsync(long sessionId, BatchSetup setup, CancellationToken cancellationToken);

    /// <summary>Records (or replaces) the range-transfer correction of a batch.</summary>
    Task<BatchInfo> RecordRangeTransferAsync(long batchId, RangeTransferCorrection correction, CancellationToken cancellationToken);

    /// <summary>Writes the part and all its readings in one transaction, allocating the next part number; idempotent by commit key.</summary>
    Task<PartRecord> CommitPartAsync(PartCommit commit, CancellationToken cancellationToken);

    /// <summary>Marks a part as announced to the operator (state Accepted becomes Announced). Idempotent.</summary>
    Task<PartRecord> MarkAnnouncedAsync(long partId, CancellationToken cancellationToken);

    /// <summary>Applies an operator correction (undo, cup correction, remeasure, removed early), keeping history.</summary>
    Task<PartRecord> UndoPartAsync(PartCorrection correction, CancellationToken cancellationToken);

    /// <summary>Finishes a session; it will not be resumed again. Idempotent.</summary>
    Task<SessionInfo> FinishSessionAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>All sessions, newest first.</summary>
    Task<IReadOnlyList<SessionInfo>> ListSessionsAsync(CancellationToken cancellationToken);

    /// <summary>Batches of a session in start order.</summary>
    Task<IReadOnlyList<BatchInfo>> GetBatchesAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>All parts of a session (every state) by part number.</summary>
    Task<IReadOnlyList<PartRecord>> GetPartsAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>One part, or null when no part has this id.</summary>
    Task<PartRecord?> GetPartAsync(long partId, CancellationToken cancellationToken);

    /// <summary>Raw readings of a part in the order taken.</summary>
    Task<IReadOnlyList<RawReading>> GetReadingsAsync(long partId, CancellationToken cancellationToken);

    /// <summary>Live parts per cup of a session, ordered by cup label.</summary>
    Task<IReadOnlyList<CupTally>> GetCupCountsAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>History of a part (corrections and library moves), oldest first.</summary>
    Task<IReadOnlyList<PartEvent>> GetPartHistoryAsync(long partId, CancellationToken cancellationToken);

    /// <summary>Searches the library.</summary>
    Task<IReadOnlyList<PartRecord>> FindPartsAsync(LibraryQuery query, CancellationToken cancellationToken);

    /// <summary>Takes parts from the library: all of them (Available and live) or none. A part is never taken twice,
    /// even by two benches at once.</summary>
    Task<LibraryResult> TakePartsAsync(IReadOnlyList<long> partIds, string takenBy, CancellationToken cancellationToken);

    /// <summary>Gives taken parts back (Taken becomes Available); all or none.</summary>
    Task<LibraryResult> ReleasePartsAsync(IReadOnlyList<long> partIds, CancellationToken cancellationToken);

    /// <summary>Marks taken parts as fitted into a build (Taken becomes Used); all or none.</summary>
    Task<LibraryResult> MarkUsedAsync(IReadOnlyList<long> partIds, string? usedIn, CancellationToken cancellationToken);

    /// <summary>Retires parts (any status but Retired becomes Retired); all or none.</summary>
    Task<LibraryResult> RetireAsync(IReadOnlyList<long> partIds, string reason, CancellationToken cancellationToken);

    /// <summary>Sets (or clears with null) the storage location of a part.</summary>
    Task<PartRecord> SetLocationAsync(long partId, string? location, CancellationToken cancellationToken);

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
    /// <param name="partIds">Parts to look up (any number, ids &gt; 0); null for every part on any drift channel.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    Task<IReadOnlyList<PartDriftRun>> GetPartDriftRunsAsync(IReadOnlyList<long>? partIds, CancellationToken cancellationToken);

    /// <summary>Gaps of a run ordered by start.</summary>
    Task<IReadOnlyList<DriftGap>> GetDriftGapsAsync(long runId, CancellationToken cancellationToken);

    /// <summary>Checks the store: engine integrity check (SQLite), foreign keys, contiguous part numbers.</summary>
    Task<IntegrityReport> VerifyAsync(CancellationToken cancellationToken);
}
