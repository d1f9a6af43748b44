using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Migrations;
using SortRig.Storage.Postgres;
using SortRig.Storage.Tests.Contracts;

namespace SortRig.Storage.Tests.Postgres;

/// <summary>
/// The contract on a real PostgreSQL server, in a fresh schema per test. The server comes from the environment:
/// SORTRIG_TEST_PG (e.g. from <c>scripts/pg-test-server start</c>). Unset: skipped with a message, except on CI
/// (CI=true), where it fails.
/// </summary>
public sealed partial class PostgresPrecisionLogTests : PrecisionLogContractTests
{
    private const string EnvironmentVariable = "SORTRIG_TEST_PG";
    private readonly string _schema = "t_" + Guid.NewGuid().ToString("N");
    private readonly SemaphoreSlim _schemaGate = new(1, 1);
    private bool _schemaCreated;

    private protected override IReadOnlyList<Migration> EngineMigrations => MigrationCatalog.Load("postgres");

    private static string ServerConnectionString()
    {
        var value = Environment.GetEnvironmentVariable(EnvironmentVariable);
        if (string.IsNullOrWhiteSpace(value))
        {
            if (Environment.GetEnvironmentVariable("CI") == "true")
            {
                throw new InvalidOperationException(
                    $"{EnvironmentVariable} is not set on CI: start a server with scripts/pg-test-server start and "
                        + $"export its output."
                );
            }

            Skip.If(
                true,
                $"PostgreSQL tests skipped: set {EnvironmentVariable} (export "
                    + $"{EnvironmentVariable}=\"$(scripts/pg-test-server start)\")."
            );
        }

        return value!;
    }

    private async Task<string> StoreConnectionStringAsync(string extra = "")
    {
        var server = ServerConnectionString();
        await _schemaGate.WaitAsync();
        try
        {
            if (!_schemaCreated)
            {
                await ExecuteAsync(server, $"CREATE SCHEMA {_schema}"); // name made here from a GUID, not input
                _schemaCreated = true;
            }
        }
        finally
        {
            _schemaGate.Release();
        }

        return $"{server};Search Path={_schema}{extra}";
    }

    protected override async Task<IPrecisionLog> OpenLogAsync(PrecisionLogOptions options) =>
        await PostgresPrecisionLog.OpenAsync(await StoreConnectionStringAsync(), options, null, CancellationToken.None);

    protected override async Task<IPrecisionLog> OpenReadOnlyLogAsync() =>
        await PostgresPrecisionLog.OpenAsync(
            await StoreConnectionStringAsync(";Options=-c default_transaction_read_only=on"),
            Options,
            null,
            CancellationToken.None
        );

    private protected override async Task<IPrecisionLog> OpenWithMigrationsAsync(IReadOnlyList<Migration> migrations) =>
        await PostgresPrecisionLog.OpenAsync(
            await StoreConnectionStringAsync(),
            Options,
            migrations,
            CancellationToken.None
        );

    protected override async Task<bool> TableExistsAsync(string table) =>
        (long)
            (
                await ScalarAsync(
                    "SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = @schema AND table_name = "
                        + "@table",
                    ("schema", _schema),
                    ("table", table)
                )
            )! > 0;

    protected override Task<object?> PlainScalarAsync(string sql) => ScalarAsync(sql);

    protected override async Task<long> SchemaVersionRowsAsync() =>
        (long)(await ScalarAsync($"SELECT COUNT(*) FROM {_schema}.schema_version"))!;

    protected override async Task DeleteStoreAsync()
    {
        if (_schemaCreated)
        {
            await ExecuteAsync(ServerConnectionString(), $"DROP SCHEMA {_schema} CASCADE");
        }

        _schemaGate.Dispose();
    }

    private async Task<object?> ScalarAsync(string sql, params (string Name, object Value)[] parameters)
    {
        await using var connection = new NpgsqlConnection(await StoreConnectionStringAsync());
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        foreach (var (name, value) in parameters)
        {
            command.Parameters.AddWithValue(name, value);
        }

        return await command.ExecuteScalarAsync();
    }

    private static async Task ExecuteAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }
}
