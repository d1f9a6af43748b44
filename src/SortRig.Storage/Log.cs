using Microsoft.Extensions.Logging;

namespace SortRig.Storage;

/// <summary>Source-generated log messages of the storage project. Event ids 3000-3999.</summary>
internal static partial class Log
{
    [LoggerMessage(
        EventId = 3001,
        Level = LogLevel.Information,
        Message = "Applied schema migration {Version} ({Name}) to {Target}"
    )]
    public static partial void MigrationApplied(ILogger logger, int version, string name, string target);

    [LoggerMessage(
        EventId = 3002,
        Level = LogLevel.Information,
        Message = "Session {SessionId} '{Name}' {How}; next part number {NextNumber}"
    )]
    public static partial void SessionOpened(ILogger logger, long sessionId, string name, string how, int nextNumber);

    [LoggerMessage(
        EventId = 3003,
        Level = LogLevel.Information,
        Message = "Commit key {CommitKey} is already stored as part {PartId}; the retried commit wrote nothing"
    )]
    public static partial void DuplicateCommit(ILogger logger, Guid commitKey, long partId);

    [LoggerMessage(
        EventId = 3004,
        Level = LogLevel.Warning,
        Message = "{Operation} hit a transient conflict on attempt {Attempt}; retrying"
    )]
    public static partial void TransientRetry(ILogger logger, string operation, int attempt, Exception exception);

    [LoggerMessage(EventId = 3005, Level = LogLevel.Error, Message = "{Operation} failed with {Fault} on {Target}")]
    public static partial void StorageFailed(
        ILogger logger,
        string operation,
        string fault,
        string target,
        Exception exception
    );

    [LoggerMessage(
        EventId = 3006,
        Level = LogLevel.Information,
        Message = "Opened {Engine} precision log {Target} at schema version {Version}"
    )]
    public static partial void Opened(ILogger logger, string engine, string target, int version);

    [LoggerMessage(
        EventId = 3007,
        Level = LogLevel.Warning,
        Message = "Batch {BatchId}: the stored reel prior (batches.reel_prior) does not read ({Reason}); "
            + "the settle rule learns the reel afresh"
    )]
    public static partial void UnreadableReelPrior(ILogger logger, long batchId, string reason);
}
