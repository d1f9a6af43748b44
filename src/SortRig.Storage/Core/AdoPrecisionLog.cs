using System.Data.Common;
using Microsoft.Extensions.Logging;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>
/// The precision log on ADO.NET, shared by both engines. Every operation opens a pooled connection; every write runs
/// in one transaction that the engine subclass begins (SQLite BEGIN IMMEDIATE, PostgreSQL READ COMMITTED) and is
/// committed before the method returns. SQL is parameterised throughout.
/// </summary>
internal abstract partial class AdoPrecisionLog : IPrecisionLog
{
    private int _disposed;

    private protected AdoPrecisionLog(PrecisionLogOptions options, string target)
    {
        Options = options;
        Target = target;
        Time = options.TimeProvider;
        Logger = options.LoggerFactory.CreateLogger(GetType());
    }

    public abstract StorageEngine Engine { get; }

    /// <summary>The database in words (file path or host:port/database) for messages.</summary>
    public string Target { get; }

    private protected PrecisionLogOptions Options { get; }

    private protected TimeProvider Time { get; }

    private protected ILogger Logger { get; }

    /// <summary>SQL appended to a row-locking SELECT (PostgreSQL " FOR UPDATE"; SQLite locks the whole file
    /// instead).</summary>
    private protected abstract string ForUpdate { get; }

    private protected abstract ValueTask<DbConnection> OpenConnectionAsync(CancellationToken cancellationToken);

    private protected abstract ValueTask<DbTransaction> BeginWriteAsync(
        DbConnection connection,
        CancellationToken cancellationToken
    );

    /// <summary>Parameter value for a time (SQLite: integer microseconds since the Unix epoch; PostgreSQL:
    /// timestamptz).</summary>
    private protected abstract object TimeValue(DateTimeOffset time);

    private protected abstract DateTimeOffset ReadTime(DbDataReader reader, int ordinal);

    private protected abstract object GuidValue(Guid value);

    /// <summary>Classifies an engine exception; transient ones are retried by writes.</summary>
    private protected abstract StorageFault Classify(DbException exception, out bool transient);

    private protected abstract Task<int> InsertDriftSamplesAsync(
        DbScope scope,
        IReadOnlyList<StoredDriftSample> samples,
        CancellationToken cancellationToken
    );

    private protected abstract Task<IReadOnlyList<string>> EngineProblemsAsync(
        DbScope scope,
        CancellationToken cancellationToken
    );

    private protected abstract ValueTask DisposeEngineAsync();

    public async ValueTask DisposeAsync()
    {
        if (Interlocked.Exchange(ref _disposed, 1) == 0)
        {
            await DisposeEngineAsync().ConfigureAwait(false);
        }

        GC.SuppressFinalize(this);
    }

    /// <summary>Truncates to the microsecond, the resolution both engines store.</summary>
    private protected static DateTimeOffset ToMicroseconds(DateTimeOffset time) =>
        new(time.UtcTicks - (time.UtcTicks % 10), TimeSpan.Zero);

    private protected object? TimeValueOrNull(DateTimeOffset? time) => time is { } t ? TimeValue(t) : null;

    private protected DateTimeOffset? ReadTimeOrNull(DbDataReader reader, int ordinal) =>
        reader.IsDBNull(ordinal) ? null : ReadTime(reader, ordinal);

    private protected static string? ReadText(DbDataReader reader, int ordinal) =>
        reader.IsDBNull(ordinal) ? null : reader.GetString(ordinal);

    /// <summary>An integer column of any width (COUNT is bigint on PostgreSQL, integer columns are int4).</summary>
    private protected static long ReadLong(DbDataReader reader, int ordinal) =>
        Convert.ToInt64(reader.GetValue(ordinal), System.Globalization.CultureInfo.InvariantCulture);

    private protected static double? ReadDouble(DbDataReader reader, int ordinal) =>
        reader.IsDBNull(ordinal) ? null : reader.GetDouble(ordinal);

    private protected void ThrowIfDisposed() =>
        ObjectDisposedException.ThrowIf(Volatile.Read(ref _disposed) != 0, this);
}
