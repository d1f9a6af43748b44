using System.Data.Common;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Running reads and transactional writes, and turning engine faults into <see
/// cref="StorageException"/>.</summary>
internal abstract partial class AdoPrecisionLog
{
    private protected async Task<T> ReadAsync<T>(
        string operation,
        Func<DbScope, CancellationToken, Task<T>> work,
        CancellationToken cancellationToken
    )
    {
        ThrowIfDisposed();
        try
        {
            var connection = await OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
            await using (connection.ConfigureAwait(false))
            {
                return await work(new DbScope(connection, null), cancellationToken).ConfigureAwait(false);
            }
        }
        catch (DbException e) when (!cancellationToken.IsCancellationRequested)
        {
            throw Fail(operation, Classify(e, out _), e);
        }
    }

    /// <summary>
    /// Runs <paramref name="work"/> in one write transaction and commits it (or rolls back when the work set
    /// <see cref="DbScope.RollbackOnly"/>). An exception rolls everything back. Transient conflicts are retried.
    /// </summary>
    private protected async Task<T> WriteAsync<T>(
        string operation,
        Func<DbScope, CancellationToken, Task<T>> work,
        CancellationToken cancellationToken
    )
    {
        ThrowIfDisposed();
        for (int attempt = 1; ; attempt++)
        {
            try
            {
                var connection = await OpenConnectionAsync(cancellationToken).ConfigureAwait(false);
                await using (connection.ConfigureAwait(false))
                {
                    var transaction = await BeginWriteAsync(connection, cancellationToken).ConfigureAwait(false);
                    await using (transaction.ConfigureAwait(false))
                    {
                        var scope = new DbScope(connection, transaction);
                        var result = await work(scope, cancellationToken).ConfigureAwait(false);

                        // Not cancellable: once the work is done the outcome must be decided, not left in doubt.
                        if (scope.RollbackOnly)
                        {
                            await transaction.RollbackAsync(CancellationToken.None).ConfigureAwait(false);
                        }
                        else
                        {
                            await transaction.CommitAsync(CancellationToken.None).ConfigureAwait(false);
                        }

                        return result;
                    }
                }
            }
            catch (DbException e) when (!cancellationToken.IsCancellationRequested)
            {
                var fault = Classify(e, out bool transient);
                if (transient && attempt <= Options.TransientRetries)
                {
                    Log.TransientRetry(Logger, operation, attempt, e);
                    continue;
                }

                throw Fail(operation, fault, e);
            }
        }
    }

    private protected StorageException Fail(string operation, StorageFault fault, Exception exception)
    {
        var error = new StorageException(
            operation,
            fault,
            Target,
            $"{Describe(fault)} ({exception.Message})",
            exception
        );
        Log.StorageFailed(Logger, operation, fault.ToString(), Target, exception);
        return error;
    }

    private protected StorageException NotFound(string operation, string what) =>
        new(operation, StorageFault.NotFound, Target, $"{what} does not exist.");

    private protected StorageException Conflict(string operation, string what) =>
        new(operation, StorageFault.Conflict, Target, what);

    private string Describe(StorageFault fault) =>
        fault switch
        {
            StorageFault.ReadOnly => "the database is read-only or writing is not permitted",
            StorageFault.Locked => $"the database stayed locked by another writer for longer than the busy timeout of "
                + $"{Options.BusyTimeout.TotalSeconds:0.#} s",
            StorageFault.DiskFull => "the disk (or the database size limit) is full",
            StorageFault.Corrupt => "the file is not a database or is damaged",
            StorageFault.Unavailable => "the database cannot be opened or reached",
            StorageFault.Constraint => "a schema constraint was violated",
            StorageFault.Conflict => "the change conflicted with another writer too often",
            StorageFault.Schema => "the schema could not be brought up to date",
            _ => "the database engine reported an error",
        };
}
