using Npgsql;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Library;

/// <summary>Engines the verb tests run on.</summary>
public enum StoreEngine
{
    Sqlite,
    Postgres,
}

/// <summary>
/// A fresh store for one test: a real SQLite file in a temporary folder, or a fresh schema on the PostgreSQL server
/// named by SORTRIG_TEST_PG. The verbs get <see cref="Database"/> exactly as a user would pass --db.
/// </summary>
public sealed class TestStore : IAsyncDisposable
{
    public const string PgVariable = "SORTRIG_TEST_PG";
    private readonly string? _folder;
    private readonly string? _server;
    private readonly string? _schema;

    private TestStore(string database, string? folder, string? server, string? schema)
    {
        Database = database;
        _folder = folder;
        _server = server;
        _schema = schema;
    }

    /// <summary>The --db value: a SQLite file path or a PostgreSQL connection string with its own search
    /// path.</summary>
    public string Database { get; }

    /// <summary>A folder for output files of this test.</summary>
    public string Folder => _folder ?? throw new InvalidOperationException("no folder");

    public static async Task<TestStore> CreateAsync(StoreEngine engine)
    {
        var folder = Directory.CreateTempSubdirectory("sortrig-library-").FullName;
        if (engine == StoreEngine.Sqlite)
        {
            return new TestStore(Path.Combine(folder, "library.db"), folder, null, null);
        }

        var server = Environment.GetEnvironmentVariable(PgVariable)
            ?? throw new InvalidOperationException(
                $"{PgVariable} is not set: start a server with scripts/pg-test-server start and export its output."
            );
        var schema = "lib_" + Guid.NewGuid().ToString("N");
        await ExecuteAsync(server, $"CREATE SCHEMA {schema}"); // name made here from a GUID, not input
        return new TestStore($"{server};Search Path={schema}", folder, server, schema);
    }

    public Task<IPrecisionLog> OpenAsync() => PrecisionLogFactory.OpenAsync(Database, null, CancellationToken.None);

    public string File(string name) => Path.Combine(Folder, name);

    public async ValueTask DisposeAsync()
    {
        NpgsqlConnection.ClearAllPools();
        if (_server is not null)
        {
            await ExecuteAsync(_server, $"DROP SCHEMA IF EXISTS {_schema} CASCADE");
        }

        if (_folder is not null)
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(_folder, recursive: true);
        }
    }

    private static async Task ExecuteAsync(string server, string sql)
    {
        await using var connection = new NpgsqlConnection(server);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }
}
