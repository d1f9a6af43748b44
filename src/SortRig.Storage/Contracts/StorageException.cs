namespace SortRig.Storage.Contracts;

/// <summary>What kind of storage fault stopped an operation.</summary>
public enum StorageFault
{
    /// <summary>Not classified; see the inner exception.</summary>
    Other = 0,

    /// <summary>The database file or server session is read-only, or writing is not permitted.</summary>
    ReadOnly = 1,

    /// <summary>Another writer held the lock longer than the busy timeout.</summary>
    Locked = 2,

    /// <summary>Disk (or the database size limit) is full.</summary>
    DiskFull = 3,

    /// <summary>The file is not a database or is damaged.</summary>
    Corrupt = 4,

    /// <summary>The file cannot be opened or the server cannot be reached.</summary>
    Unavailable = 5,

    /// <summary>A constraint of the schema was violated.</summary>
    Constraint = 6,

    /// <summary>The change conflicts with the stored state (e.g. committing into a finished session).</summary>
    Conflict = 7,

    /// <summary>A referenced session, batch, part or run does not exist.</summary>
    NotFound = 8,

    /// <summary>The schema in the store is newer than this build or a migration failed.</summary>
    Schema = 9,
}

/// <summary>
/// A storage operation failed. Nothing of the failed operation was written: every write runs in one transaction.
/// </summary>
public sealed class StorageException : Exception
{
    /// <summary>Creates the exception.</summary>
    /// <param name="operation">The operation that failed, in words (e.g. "commit part").</param>
    /// <param name="fault">Kind of fault.</param>
    /// <param name="target">The database: file path or host/database, never a password.</param>
    /// <param name="detail">What went wrong, in words.</param>
    /// <param name="inner">The engine's exception, if any.</param>
    public StorageException(string operation, StorageFault fault, string target, string detail, Exception? inner = null)
        : base($"Precision log: {operation} failed on {target}: {detail}", inner)
    {
        Operation = operation;
        Fault = fault;
        Target = target;
    }

    /// <summary>The operation that failed.</summary>
    public string Operation { get; }

    /// <summary>Kind of fault.</summary>
    public StorageFault Fault { get; }

    /// <summary>The database: file path or host/database.</summary>
    public string Target { get; }
}
