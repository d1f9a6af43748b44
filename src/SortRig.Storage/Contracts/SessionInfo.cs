namespace SortRig.Storage.Contracts;

/// <summary>A sorting session: one sitting at the bench, possibly spanning several batches.</summary>
/// <param name="Id">Database id, &gt; 0.</param>
/// <param name="Name">Session name chosen by the operator; resume looks for the latest unfinished session with this
/// name.</param>
/// <param name="Operator">Who runs the bench; null when not given.</param>
/// <param name="Notes">Free text; null when not given.</param>
/// <param name="StartedAt">When the session was created (UTC, microsecond resolution).</param>
/// <param name="FinishedAt">When <see cref="ISessionLog.FinishSessionAsync"/> was called; null while open.</param>
public sealed record SessionInfo(
    long Id,
    string Name,
    string? Operator,
    string? Notes,
    DateTimeOffset StartedAt,
    DateTimeOffset? FinishedAt
)
{
    /// <summary>True once the session has been finished; a finished session is never resumed.</summary>
    public bool IsFinished => FinishedAt is not null;
}

/// <summary>What the host asks for when it opens a session.</summary>
/// <param name="Name">Session name, 1..200 characters.</param>
/// <param name="Operator">Who runs the bench, optional.</param>
/// <param name="Notes">Free text, optional.</param>
/// <param name="ResumeUnfinished">When true (default) the latest unfinished session with the same name is resumed
/// instead of starting a new one.</param>
/// <param name="ReopenFinished">When true and no unfinished session has the name, the latest finished one is
/// reopened (its finish time cleared) instead of starting a new one: a job carried on with another batch, such as
/// the 2R parts of a ladder after its R parts. Default false.</param>
public sealed record SessionRequest(
    string Name,
    string? Operator = null,
    string? Notes = null,
    bool ResumeUnfinished = true,
    bool ReopenFinished = false
);
