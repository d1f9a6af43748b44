namespace SortRig.Storage.Contracts;

/// <summary>
/// Everything the host needs to carry on with a session after opening it, including after a crash.
/// </summary>
/// <param name="Session">The session opened or resumed.</param>
/// <param name="Resumed">True when an existing unfinished session was resumed.</param>
/// <param name="NextPartNumber">The number the next committed part will get (1 for a new session).</param>
/// <param name="CupCounts">Parts currently in each cup (state Accepted or Announced), ordered by label.</param>
/// <param name="Unannounced">Parts committed but not yet announced to the operator, by part number; the host
/// announces them again after a crash.</param>
/// <param name="Batches">Batches of the session in start order; the last one is the batch in progress.</param>
public sealed record SessionState(
    SessionInfo Session,
    bool Resumed,
    int NextPartNumber,
    IReadOnlyList<CupTally> CupCounts,
    IReadOnlyList<PartRecord> Unannounced,
    IReadOnlyList<BatchInfo> Batches
)
{
    /// <summary>The batch in progress, or null when the session has none yet.</summary>
    public BatchInfo? CurrentBatch => Batches.Count == 0 ? null : Batches[^1];
}

/// <summary>How many live parts (Accepted or Announced) sit in one cup.</summary>
/// <param name="CupLabel">The cup label as committed.</param>
/// <param name="Count">Number of parts, &gt;= 1.</param>
public readonly record struct CupTally(string CupLabel, int Count);
