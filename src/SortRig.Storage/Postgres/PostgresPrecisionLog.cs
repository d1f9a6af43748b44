using System.Data;
using System.Data.Common;
using System.Globalization;
using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Core;
using SortRig.Storage.Migrations;

namespace SortRig.Storage.Postgres;

/// <summary>
/// The precision log on a PostgreSQL server (shared lab library), through a pooled NpgsqlDataSource. Writes run in
/// READ COMMITTED transactions and take row locks (UPDATE of the session row for part numbers, SELECT ... FOR UPDATE
/// in id order for library changes); PostgreSQL 15 manual sec. 13.2.1 and 13.3.2. Serialization failures and
/// deadlocks are retried. lock_timeout is set from <see cref="PrecisionLogOptions.BusyTimeout"/>.
/// </summary>
internal sealed partial class PostgresPrecisionLog : AdoPrecisionLog
{
    private readonly NpgsqlDataSource _dataSource;

    private PostgresPrecisionLog(NpgsqlDataSource dataSource, PrecisionLogOptions options, string target)
        : base(options, target)
    {
        _dataSource = dataSource;
    }

    public override StorageEngine Engine => StorageEngine.Postgres;

    private protected override string ForUpdate => " FOR UPDATE";

    private protected override string SchemaVersionDdl =>
        "CREATE TABLE IF NOT EXISTS schema_version (version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_at "
        + "TIMESTAMPTZ NOT NULL)";

    /// <summary>Connects and applies pending migrations (in the connection's search path schema).</summary>
    /// <param name="connectionString">Npgsql connection string ("Host=...;Database=...;Username=...").</param>
    /// <param name="options">Options.</param>
    /// <param name="migrations">Scripts to apply; null for the embedded ones (tests pass their own).</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static async Task<PostgresPrecisionLog> OpenAsync(
        string connectionString,
        PrecisionLogOptions options,
        IReadOnlyList<Migration>? migrations,
        CancellationToken cancellationToken
    )
    {
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        var ms = ((long)options.BusyTimeout.TotalMilliseconds).ToString(CultureInfo.InvariantCulture);
        builder.Options = string.IsNullOrWhiteSpace(builder.Options)
            ? $"-c lock_timeout={ms}"
            : $"{builder.Options} -c lock_timeout={ms}";
        ApplyTimeouts(builder, connectionString, options.CommandTimeout);
        var target =
            $"postgresql {builder.Host}:{builder.Port}/{builder.Database}"
            + (string.IsNullOrEmpty(builder.SearchPath) ? string.Empty : $" (schema {builder.SearchPath})");
        var sourceBuilder = new NpgsqlDataSourceBuilder(builder.ConnectionString);
        sourceBuilder.UseLoggerFactory(options.LoggerFactory);
        var log = new PostgresPrecisionLog(sourceBuilder.Build(), options, target);
        try
        {
            int version = await log.MigrateAsync(migrations ?? MigrationCatalog.Load("postgres"), cancellationToken)
                .ConfigureAwait(false);
            Log.Opened(log.Logger, "PostgreSQL", log.Target, version);
            return log;
        }
        catch
        {
            await log.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    private protected override async ValueTask<DbConnection> OpenConnectionAsync(CancellationToken cancellationToken) =>
        await _dataSource.OpenConnectionAsync(cancellationToken).ConfigureAwait(false);

    private protected override async ValueTask<DbTransaction> BeginWriteAsync(
        DbConnection connection,
        CancellationToken cancellationToken
    ) =>
        await ((NpgsqlConnection)connection)
            .BeginTransactionAsync(IsolationLevel.ReadCommitted, cancellationToken)
            .ConfigureAwait(false);

    private protected override object TimeValue(DateTimeOffset time) => ToMicroseconds(time);

    private protected override DateTimeOffset ReadTime(DbDataReader reader, int ordinal) =>
        reader.GetFieldValue<DateTimeOffset>(ordinal);

    private protected override object GuidValue(Guid value) => value;

    /// <summary>One advisory lock key for every SortRig migrator on the database ("SRPL").</summary>
    private protected override Task LockForMigrationAsync(DbScope scope, CancellationToken cancellationToken) =>
        scope.Sql("SELECT pg_advisory_xact_lock(@key)").With("key", 0x5352_504CL).ExecuteAsync(cancellationToken);

    private protected override async Task<bool> SchemaVersionExistsAsync(
        DbScope scope,
        CancellationToken cancellationToken
    ) =>
        await scope
            .Sql(
                "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = current_schema() AND table_name "
                    + "= 'schema_version'"
            )
            .ScalarLongAsync(cancellationToken)
            .ConfigureAwait(false) > 0;

    private protected override ValueTask DisposeEngineAsync() => _dataSource.DisposeAsync();
}
