namespace SortRig.Storage.Contracts;

/// <summary>
/// The durable precision log: sessions, batches, parts with their raw readings, the part library and drift logs.
/// Every write is one transaction, committed durably before the method returns. Faults of the store surface as
/// <see cref="StorageException"/>; caller cancellation as <see cref="OperationCanceledException"/>.
/// Bad arguments throw <see cref="ArgumentException"/> naming the field. Safe to call from several threads.
/// The roles (<see cref="ISessionLog"/>, <see cref="ISessionReader"/>, <see cref="IPartLibrary"/>,
/// <see cref="IDriftLog"/>, <see cref="ICheckLog"/>) are
/// what its contract tests and its callers use; a caller that needs one role takes that interface.
/// </summary>
public interface IPrecisionLog : ISessionLog, ISessionReader, IPartLibrary, IDriftLog, ICheckLog, IAsyncDisposable
{
    /// <summary>Engine behind this log.</summary>
    StorageEngine Engine { get; }

    /// <summary>Checks the store: engine integrity check (SQLite), foreign keys, contiguous part numbers.</summary>
    Task<IntegrityReport> VerifyAsync(CancellationToken cancellationToken);
}
