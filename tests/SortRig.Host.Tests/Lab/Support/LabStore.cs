using Npgsql;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Storage.Lab;

namespace SortRig.Host.Tests.Lab.Support;

/// <summary>
/// A lab made for one test on a PostgreSQL server: owner and writer roles and a schema (LabRoles, the same SQL a
/// keeper runs), migrated by the owner. Benches get <see cref="Writer"/>. Dropped on dispose. Names come from GUIDs.
/// </summary>
internal sealed class LabStore : IAsyncDisposable
{
    public const string PgVariable = "SORTRIG_TEST_PG";
    private readonly string _admin;

    private LabStore(string admin, LabRoleNames names)
    {
        _admin = admin;
        Names = names;
    }

    public LabRoleNames Names { get; }

    /// <summary>The bench's --db: the writer role, its search path the lab schema (set by LabRoles), no
    /// password.</summary>
    public string Writer => With(_admin, Names.Writer);

    /// <summary>The writer's connection string through another host and port (a proxy).</summary>
    public string WriterVia(int port) =>
        new NpgsqlConnectionStringBuilder(Writer) { Host = "127.0.0.1", Port = port }.ConnectionString;

    public static string ServerFromEnvironment() =>
        Environment.GetEnvironmentVariable(PgVariable) is { Length: > 0 } s
            ? s
            : throw new InvalidOperationException(
                $"{PgVariable} is not set: start a server with scripts/pg-test-server start and export its output."
            );

    /// <param name="admin">A superuser connection string; default the test server.</param>
    public static async Task<LabStore> CreateAsync(string? admin = null)
    {
        admin ??= ServerFromEnvironment();
        string id = Guid.NewGuid().ToString("N")[..8];
        var store = new LabStore(admin, new LabRoleNames($"lo_{id}", $"lw_{id}", $"lab_{id}"));
        await LabRoles.ApplyAsync(admin, store.Names, CancellationToken.None);
        await using (await PrecisionLogFactory.OpenAsync(With(admin, store.Names.Owner), null, CancellationToken.None))
        {
            // The owner migrates; benches never do.
        }

        return store;
    }

    public Task<IPrecisionLog> OpenAsync(PrecisionLogOptions? options = null) =>
        PrecisionLogFactory.OpenAsync(Writer, options, CancellationToken.None);

    /// <summary>Stocks the library: one finished session of <paramref name="count"/> 10 kOhm parts, returns their
    /// ids.</summary>
    public async Task<long[]> StockLibraryAsync(int count)
    {
        await using var log = await OpenAsync();
        var session = await log.OpenOrResumeSessionAsync(
            new SessionRequest("lab-stock", "keeper"),
            CancellationToken.None
        );
        var setup = new BatchSetup(
            10_000,
            10_000,
            500,
            100_000,
            10,
            true,
            "sim-dmm-6",
            "SORTRIG,SIM-DMM-6,0001,1.0",
            null
        );
        var batch = await log.StartBatchAsync(session.Session.Id, setup, CancellationToken.None);
        var at = new DateTimeOffset(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);
        var ids = new List<long>();
        for (int i = 0; i < count; i++)
        {
            double value = 10_000 * (1 + ((i * 37 % 19) - 9) * 20e-6); // invented spread of deviations, ±180 ppm
            var raw = Enumerable
                .Range(0, 8)
                .Select(k =>
                    Reading.Finite(value + ((k - 4) * 0.001), at.AddSeconds(i * 30).AddMilliseconds(k * 100), 100_000)
                )
                .ToArray();
            var part = await log.CommitPartAsync(
                new PartCommit(
                    Guid.NewGuid(),
                    session.Session.Id,
                    batch.Id,
                    new MeasuredValue(value, value * 12e-6, value * 1.5e-6),
                    100_000,
                    10,
                    22.8,
                    at.AddSeconds(i * 30),
                    "A",
                    null,
                    raw
                ),
                CancellationToken.None
            );
            ids.Add(part.Id);
        }

        await log.FinishSessionAsync(session.Session.Id, CancellationToken.None);
        return [.. ids];
    }

    public async ValueTask DisposeAsync()
    {
        NpgsqlConnection.ClearAllPools();
        try
        {
            await ExecuteAsync(_admin, "SELECT 1");
        }
        catch (NpgsqlException e) when (e.InnerException is System.Net.Sockets.SocketException)
        {
            // The server is down (a test that stops its own server and failed before starting it again): there is
            // nothing left to clean, and throwing here would hide the test's own failure.
            return;
        }

        await ExecuteAsync(_admin, $"DROP SCHEMA IF EXISTS {Names.Schema} CASCADE");
        foreach (var role in new[] { Names.Owner, Names.Writer })
        {
            await ExecuteAsync(_admin, $"DROP OWNED BY {role} CASCADE");
            await ExecuteAsync(_admin, $"DROP ROLE IF EXISTS {role}");
        }
    }

    private static string With(string admin, string role) =>
        new NpgsqlConnectionStringBuilder(admin) { Username = role }.ConnectionString;

    private static async Task ExecuteAsync(string connectionString, string sql)
    {
        await using var connection = new NpgsqlConnection(connectionString);
        await connection.OpenAsync();
        await using var command = new NpgsqlCommand(sql, connection);
        await command.ExecuteNonQueryAsync();
    }
}
