using Microsoft.Data.Sqlite;
using SortRig.Storage.Contracts;
using SortRig.Storage.Migrations;
using SortRig.Storage.Sqlite;
using SortRig.Storage.Tests.Contracts;

namespace SortRig.Storage.Tests.Sqlite;

/// <summary>The contract on real SQLite files in a fresh temp directory per test, plus SQLite-only checks.</summary>
public sealed partial class SqlitePrecisionLogTests : PrecisionLogContractTests
{
    private readonly string _directory = Directory.CreateTempSubdirectory("sortrig-storage-").FullName;

    private string FilePath => Path.Combine(_directory, "precision.db");

    private protected override IReadOnlyList<Migration> EngineMigrations => MigrationCatalog.Load("sqlite");

    protected override async Task<IPrecisionLog> OpenLogAsync(PrecisionLogOptions options) =>
        await SqlitePrecisionLog.OpenAsync($"Data Source={FilePath}", options, null, CancellationToken.None);

    protected override async Task<IPrecisionLog> OpenReadOnlyLogAsync() =>
        await SqlitePrecisionLog.OpenAsync(
            $"Data Source={FilePath};Mode=ReadOnly",
            Options,
            null,
            CancellationToken.None
        );

    private protected override async Task<IPrecisionLog> OpenWithMigrationsAsync(IReadOnlyList<Migration> migrations) =>
        await SqlitePrecisionLog.OpenAsync($"Data Source={FilePath}", Options, migrations, CancellationToken.None);

    protected override async Task<bool> TableExistsAsync(string table) =>
        await ScalarAsync("SELECT COUNT(*) FROM sqlite_master WHERE type = 'table' AND name = $name", ("$name", table))
            is long n
        && n > 0;

    protected override Task<object?> PlainScalarAsync(string sql) => ScalarAsync(sql);

    protected override async Task<long> SchemaVersionRowsAsync() =>
        (long)(await ScalarAsync("SELECT COUNT(*) FROM schema_version"))!;

    protected override Task DeleteStoreAsync()
    {
        SqliteConnection.ClearAllPools();
        Directory.Delete(_directory, recursive: true);
        return Task.CompletedTask;
    }

    /// <summary>Runs one query on its own plain connection, outside the code under test.</summary>
    private async Task<object?> ScalarAsync(string sql, params (string Name, object Value)[] parameters)
    {
        await using var connection = new SqliteConnection($"Data Source={FilePath};Pooling=False");
        await connection.OpenAsync();
        await using var command = connection.CreateCommand();
        command.CommandText = sql;
        foreach (var (name, value) in parameters)
        {
            command.Parameters.AddWithValue(name, value);
        }

        return await command.ExecuteScalarAsync();
    }
}
