using System.Data;
using System.Data.Common;
using System.Globalization;
using Microsoft.Data.Sqlite;
using SortRig.Storage.Contracts;
using SortRig.Storage.Core;
using SortRig.Storage.Migrations;

namespace SortRig.Storage.Sqlite;

/// <summary>
/// The precision log in an embedded SQLite file: WAL journal, foreign keys on, synchronous=FULL (a commit is on disk
/// before the method returns), busy_timeout, every write in a BEGIN IMMEDIATE transaction (one writer at a time per
/// file, readers never blocked). See https://sqlite.org/wal.html and https://sqlite.org/lang_transaction.html.
/// </summary>
internal sealed partial class SqlitePrecisionLog : AdoPrecisionLog
{
    private readonly string _connectionString;
    private readonly string _pragmas;

    private SqlitePrecisionLog(string connectionString, bool readOnly, PrecisionLogOptions options, string target)
        : base(options, target)
    {
        _connectionString = connectionString;
        IsReadOnly = readOnly;

        // PRAGMA takes no bound parameters; these are integers from validated options, never outside input.
        var ms = ((long)options.BusyTimeout.TotalMilliseconds).ToString(CultureInfo.InvariantCulture);
        _pragmas =
            $"PRAGMA busy_timeout = {ms}; PRAGMA synchronous = FULL;"
            + (
                options.SqliteMaxPageCount is { } pages
                    ? $" PRAGMA max_page_count = {pages.ToString(CultureInfo.InvariantCulture)};"
                    : string.Empty
            );
    }

    public override StorageEngine Engine => StorageEngine.Sqlite;

    /// <summary>True when opened with Mode=ReadOnly.</summary>
    public bool IsReadOnly { get; }

    private protected override string ForUpdate => string.Empty;

    private protected override string SchemaVersionDdl =>
        "CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_at "
        + "INTEGER NOT NULL)";

    /// <summary>Opens (creating if needed) the file, switches it to WAL and applies pending migrations.</summary>
    /// <param name="connectionString">"Data Source=path" (other Microsoft.Data.Sqlite keywords allowed) or a bare
    /// path.</param>
    /// <param name="options">Options.</param>
    /// <param name="migrations">Scripts to apply; null for the embedded ones (tests pass their own).</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static async Task<SqlitePrecisionLog> OpenAsync(
        string connectionString,
        PrecisionLogOptions options,
        IReadOnlyList<Migration>? migrations,
        CancellationToken cancellationToken
    )
    {
        var builder = connectionString.Contains('=', StringComparison.Ordinal)
            ? new SqliteConnectionStringBuilder(connectionString)
            : new SqliteConnectionStringBuilder { DataSource = connectionString.Trim() };
        if (
            string.IsNullOrWhiteSpace(builder.DataSource)
            || builder.DataSource == ":memory:"
            || builder.Mode == SqliteOpenMode.Memory
        )
        {
            throw new ArgumentException(
                "A SQLite precision log needs a file: 'Data Source=path/to/log.db' (in-memory databases are not "
                    + "durable).",
                nameof(connectionString)
            );
        }

        RequireFilePath(builder.DataSource, writes: builder.Mode != SqliteOpenMode.ReadOnly);
        builder.DefaultTimeout = (int)Math.Ceiling(options.BusyTimeout.TotalSeconds);
        builder.ForeignKeys = true;
        // a size-capped test connection must not go back to the shared pool
        builder.Pooling = options.SqliteMaxPageCount is null;
        var log = new SqlitePrecisionLog(
            builder.ToString(),
            builder.Mode == SqliteOpenMode.ReadOnly,
            options,
            Path.GetFullPath(builder.DataSource)
        );
        try
        {
            if (!log.IsReadOnly)
            {
                await log.ReadAsync(
                        "switch to WAL journal",
                        (s, ct) => s.Sql("PRAGMA journal_mode = WAL").ExecuteAsync(ct),
                        cancellationToken
                    )
                    .ConfigureAwait(false);
            }

            int version = await log.MigrateAsync(migrations ?? MigrationCatalog.Load("sqlite"), cancellationToken)
                .ConfigureAwait(false);
            Log.Opened(log.Logger, "SQLite", log.Target, version);
            return log;
        }
        catch
        {
            await log.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    /// <summary>
    /// SQLite keeps its journal beside the database: a folder or a device (/dev/null, /dev/zero) is refused before
    /// anything is opened, so no journal file is left next to it.
    /// </summary>
    /// <exception cref="ArgumentException">The path is a folder or a device.</exception>
    /// <exception cref="StorageException">The folder does not exist or cannot be written (<see
    /// cref="StorageFault.Unavailable"/>).</exception>
    internal static void RequireFilePath(string dataSource, bool writes)
    {
        var full = Path.GetFullPath(dataSource);
        if (Directory.Exists(full))
        {
            throw new ArgumentException(
                $"'{dataSource}' is a folder; a SQLite precision log is a file (e.g. '"
                    + $"{Path.Combine(dataSource, "sortrig.db")}')"
            );
        }

        // Devices live under /dev; /dev/shm is the one ordinary file system there (shared memory, a tmpfs).
        if (
            full.StartsWith("/dev/", StringComparison.Ordinal)
            && !full.StartsWith("/dev/shm/", StringComparison.Ordinal)
        )
        {
            throw new ArgumentException($"'{dataSource}' is a device; a SQLite precision log is a regular file");
        }

        var folder = Path.GetDirectoryName(full) ?? "/";
        if (!Directory.Exists(folder))
        {
            throw new StorageException(
                "open",
                StorageFault.Unavailable,
                full,
                $"the folder '{folder}' does not exist; create it or check the path"
            );
        }

        if (!writes)
        {
            return;
        }

        // The database and its journal are written in that folder: try it with a file that deletes itself.
        try
        {
            using var probe = new FileStream(
                Path.Combine(folder, $".sortrig-write-check-{Guid.NewGuid():N}"),
                FileMode.CreateNew,
                FileAccess.Write,
                FileShare.None,
                1,
                FileOptions.DeleteOnClose
            );
        }
        catch (Exception e) when (e is UnauthorizedAccessException or IOException)
        {
            throw new StorageException(
                "open",
                StorageFault.Unavailable,
                full,
                $"the folder '{folder}' is not writable; the database and its journal are written there",
                e
            );
        }
    }

    private protected override async ValueTask<DbConnection> OpenConnectionAsync(CancellationToken cancellationToken)
    {
        var connection = new SqliteConnection(_connectionString);
        try
        {
            await connection.OpenAsync(cancellationToken).ConfigureAwait(false);
            using var pragma = connection.CreateCommand();
            pragma.CommandText = _pragmas;
            await pragma.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            return connection;
        }
        catch
        {
            await connection.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    /// <summary>BEGIN IMMEDIATE: takes the write lock up front, so a transaction never fails half-way on a lock
    /// upgrade.</summary>
    private protected override ValueTask<DbTransaction> BeginWriteAsync(
        DbConnection connection,
        CancellationToken cancellationToken
    )
    {
        cancellationToken.ThrowIfCancellationRequested();
        return ValueTask.FromResult<DbTransaction>(
            ((SqliteConnection)connection).BeginTransaction(IsolationLevel.Serializable, deferred: false)
        );
    }

    private protected override object TimeValue(DateTimeOffset time) =>
        (time.UtcTicks - DateTimeOffset.UnixEpoch.UtcTicks) / 10;

    private protected override DateTimeOffset ReadTime(DbDataReader reader, int ordinal) =>
        DateTimeOffset.UnixEpoch.AddTicks(reader.GetInt64(ordinal) * 10);

    private protected override object GuidValue(Guid value) => value.ToString("D");

    private protected override ValueTask DisposeEngineAsync()
    {
        using var connection = new SqliteConnection(_connectionString);
        SqliteConnection.ClearPool(connection);
        return ValueTask.CompletedTask;
    }
}
