namespace SortRig.Storage.Contracts;

/// <summary>Recording a sorting session: sessions, batches, range transfers, parts committed, announced and undone. One
/// role of <see cref="IPrecisionLog"/>; the same transaction, fault and argument rules.</summary>
public interface ISessionLog
{
    /// <summary>Resumes the latest unfinished session with the request's name (unless told not to) or starts a new
    /// one.</summary>
    Task<SessionState> OpenOrResumeSessionAsync(SessionRequest request, CancellationToken cancellationToken);

    /// <summary>Starts a batch in an open session.</summary>
    Task<BatchInfo> StartBatchAsync(long sessionId, BatchSetup setup, CancellationToken cancellationToken);

    /// <summary>Records (or replaces) the range-transfer correction of a batch.</summary>
    Task<BatchInfo> RecordRangeTransferAsync(
        long batchId,
        RangeTransferCorrection correction,
        CancellationToken cancellationToken
    );

    /// <summary>Writes the part and all its readings in one transaction, allocating the next part number; idempotent by
    /// commit key.</summary>
    Task<PartRecord> CommitPartAsync(PartCommit commit, CancellationToken cancellationToken);

    /// <summary>Writes a part measured again and marks the part it replaces <see cref="PartState.Remeasured"/> in one
    /// transaction (so a crash between the two neither loses the part nor keeps it twice); idempotent by commit key.
    /// The replaced part's history note is <paramref name="replaced"/>'s note followed by the new part
    /// number.</summary>
    /// <param name="commit">The new record.</param>
    /// <param name="replaced">The correction of the old record; its kind must be
    /// <see cref="PartCorrectionKind.Remeasure"/>.</param>
    /// <param name="cancellationToken">Stops the write; nothing is written then.</param>
    Task<PartRecord> CommitRemeasureAsync(
        PartCommit commit,
        PartCorrection replaced,
        CancellationToken cancellationToken
    );

    /// <summary>Marks a part as announced to the operator (state Accepted becomes Announced). Idempotent.</summary>
    Task<PartRecord> MarkAnnouncedAsync(long partId, CancellationToken cancellationToken);

    /// <summary>Applies an operator correction (undo, cup correction, remeasure, removed early), keeping
    /// history.</summary>
    Task<PartRecord> UndoPartAsync(PartCorrection correction, CancellationToken cancellationToken);

    /// <summary>Records (or replaces) the build a session sorts toward (schema version 4).</summary>
    Task SetBuildTargetAsync(long sessionId, BuildTargetRecord target, CancellationToken cancellationToken);

    /// <summary>Finishes a session; it will not be resumed again. Idempotent.</summary>
    Task<SessionInfo> FinishSessionAsync(long sessionId, CancellationToken cancellationToken);
}
