namespace SortRig.Storage.Contracts;

/// <summary>
/// The check standard's readings and the parts they put under suspicion (schema version 5). One role of
/// <see cref="IPrecisionLog"/>; the same transaction, fault and argument rules.
/// </summary>
public interface ICheckLog
{
    /// <summary>
    /// Writes one check reading in one transaction, numbering it in its session; when it is out of control, flags in
    /// the same transaction every live part of the session measured since the last check in control. Idempotent by
    /// commit key: a retry after a crash returns the first record and flags nothing twice.
    /// </summary>
    Task<CheckRecord> RecordCheckAsync(CheckCommit commit, CancellationToken cancellationToken);

    /// <summary>The checks of a session, in order.</summary>
    Task<IReadOnlyList<CheckRecord>> GetSessionChecksAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>The readings of one check part across all sessions, oldest first; at most <paramref name="limit"/> of
    /// the newest (1 to 100 000).</summary>
    Task<IReadOnlyList<CheckRecord>> GetCheckHistoryAsync(
        string checkName,
        int limit,
        CancellationToken cancellationToken
    );

    /// <summary>Part ids of the session that are flagged and still live (suspect until measured again), by part
    /// number.</summary>
    Task<IReadOnlyList<long>> GetSuspectPartsAsync(long sessionId, CancellationToken cancellationToken);

    /// <summary>Part ids of the session ever flagged by a check (live or since measured again), by part
    /// number.</summary>
    Task<IReadOnlyList<long>> GetFlaggedPartsAsync(long sessionId, CancellationToken cancellationToken);
}
