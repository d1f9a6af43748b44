namespace SortRig.Storage.Contracts;

/// <summary>Reading sessions back: sessions, batches, parts, raw readings, cup counts and part histories. One role of
/// <see cref="IPrecisionLog"/>; the same transaction, fault and argument rules.</summary>
public interface ISessionReader
{
    /// <summary>All sessions, newest first.</summary>
    Task<IReadOnlyList<SessionInfo>> ListSessionsAsync(CancellationToken cancellationToken);

    /// <summary>The build the session sorts toward, or null when it sorts the whole reel.</summary>
    Task<BuildTargetRecord?> GetBuildTargetAsync(long sessionId, CancellationToken cancellationToken);

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
}
