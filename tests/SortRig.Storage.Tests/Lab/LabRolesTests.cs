using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Lab;
using SortRig.Storage.Tests.Contracts;

namespace SortRig.Storage.Tests.Lab;

/// <summary>
/// Least privilege on a real server: the owner migrates, a bench logged in as the writer role writes rows but can
/// change nothing in the schema. Privilege semantics from the PostgreSQL 15 manual, sec. 5.7 (Privileges: only the
/// owner may ALTER or DROP an object; CREATE on a schema is needed to create in it; TEMPORARY on the database to
/// make temporary tables) and sec. 5.9.6 (REVOKE CREATE ON SCHEMA public FROM PUBLIC).
/// </summary>
public sealed class LabRolesTests : IAsyncLifetime
{
    private readonly LabRoleNames _names = new(LabServer.Name("lo"), LabServer.Name("lw"), LabServer.Name("lab"));

    public Task InitializeAsync() => Task.CompletedTask;

    public async Task DisposeAsync()
    {
        if (!string.IsNullOrWhiteSpace(Environment.GetEnvironmentVariable("SORTRIG_TEST_PG")))
        {
            NpgsqlConnection.ClearAllPools();
            await LabServer.DropLabAsync(_names.Schema, _names.Owner, _names.Writer);
        }
    }

    [SkippableFact]
    public async Task WriterRole_WritesPartsButCannotCreateAlterOrDropTables()
    {
        await LabRoles.ApplyAsync(LabServer.ConnectionString(), _names, CancellationToken.None);
        await using (
            var owner = await PrecisionLogFactory.OpenAsync(LabServer.As(_names.Owner), null, CancellationToken.None)
        )
        {
            // migrated into the lab schema (the owner's search_path)
            Assert.Equal(StorageEngine.Postgres, owner.Engine);
        }

        // The bench: the schema is current, so opening writes nothing; sorting and library moves work.
        await using var bench = await PrecisionLogFactory.OpenAsync(
            LabServer.As(_names.Writer),
            null,
            CancellationToken.None
        );
        var (session, batch) = await Bench.StartAsync(bench, "lab-least-privilege");
        var part = await Bench.CommitAsync(bench, session.Session.Id, batch, Bench.TenKAt(120));
        Assert.True((await bench.TakePartsAsync([part.Id], "bench-3", CancellationToken.None)).Succeeded);
        Assert.Single(await bench.GetPartsAsync(session.Session.Id, CancellationToken.None));

        var writer = LabServer.As(_names.Writer);
        string schema = _names.Schema;
        foreach (
            var ddl in new[]
            {
                $"CREATE TABLE {schema}.bench_notes (id int)",
                "CREATE TABLE bench_notes (id int)", // in its search_path schema
                "CREATE TABLE public.bench_notes (id int)",
                "CREATE TEMPORARY TABLE bench_notes (id int)",
                $"DROP TABLE {schema}.parts",
                $"DROP TABLE {schema}.schema_version",
                $"ALTER TABLE {schema}.parts ADD COLUMN note text",
                $"TRUNCATE {schema}.drift_samples",
                $"DELETE FROM {schema}.parts", // the log is append-only for a bench
                $"CREATE INDEX ix_bench ON {schema}.parts (value_ohms)",
                $"CREATE SCHEMA {LabServer.Name("rogue")}",
            }
        )
        {
            var error = await Assert.ThrowsAsync<PostgresException>(() => LabServer.ExecuteAsync(writer, ddl));
            // insufficient_privilege
            Assert.True(error.SqlState == "42501", $"{ddl}: {error.SqlState} {error.MessageText}");
        }

        Assert.Equal(
            1L,
            await LabServer.ScalarAsync(LabServer.ConnectionString(), $"SELECT COUNT(*) FROM {schema}.parts")
        );
    }

    [SkippableFact]
    public async Task WriterRole_OpeningAStoreThatNeedsMigrating_FailsWithSchemaFaultSendingItToTheOwner()
    {
        await LabRoles.ApplyAsync(LabServer.ConnectionString(), _names, CancellationToken.None);

        // Nobody has migrated yet: the writer may not, and says who can.
        var error = await Assert.ThrowsAsync<StorageException>(() =>
            PrecisionLogFactory.OpenAsync(LabServer.As(_names.Writer), null, CancellationToken.None)
        );

        Assert.Equal(StorageFault.Schema, error.Fault);
        Assert.Contains("owner role", error.Message, StringComparison.Ordinal);
        Assert.Equal(
            0L,
            await LabServer.ScalarAsync(
                LabServer.ConnectionString(),
                $"SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = '{_names.Schema}'"
            )
        );
    }

    [SkippableFact]
    public async Task ApplyTwice_IsIdempotent_AndTablesOfALaterMigrationAreGrantedToo()
    {
        var admin = LabServer.ConnectionString();
        await LabRoles.ApplyAsync(admin, _names, CancellationToken.None);
        await LabRoles.ApplyAsync(admin, _names, CancellationToken.None);

        // A table the owner makes later (a future migration) reaches the writer by the default privileges.
        await LabServer.ExecuteAsync(
            LabServer.As(_names.Owner),
            $"CREATE TABLE {_names.Schema}.later (id BIGINT GENERATED ALWAYS AS IDENTITY, v int)"
        );
        await LabServer.ExecuteAsync(LabServer.As(_names.Writer), $"INSERT INTO {_names.Schema}.later (v) VALUES (1)");
        Assert.Equal(
            1L,
            await LabServer.ScalarAsync(LabServer.As(_names.Writer), $"SELECT COUNT(*) FROM {_names.Schema}.later")
        );
    }

    [Theory]
    [InlineData("Sortrig_owner", "sortrig_writer", "sortrig", "Owner")]
    [InlineData("sortrig_owner", "w; DROP TABLE parts", "sortrig", "Writer")]
    [InlineData("sortrig_owner", "sortrig_writer", "1lab", "Schema")]
    [InlineData("same", "same", "sortrig", "Writer")]
    public void Script_NameThatIsNotAPlainIdentifier_IsRefusedNamingTheField(
        string owner,
        string writer,
        string schema,
        string field
    )
    {
        var error = Assert.Throws<ArgumentException>(() =>
            LabRoles.Script(new LabRoleNames(owner, writer, schema), "sortrig")
        );
        Assert.Equal(field, error.ParamName);
    }

    [Fact]
    public void Script_DatabaseNameThatIsNotAPlainIdentifier_IsRefusedNamingIt()
    {
        var error = Assert.Throws<ArgumentException>(() =>
            LabRoles.Script(new LabRoleNames(), "sortrig; DROP DATABASE x")
        );
        Assert.Equal("database", error.ParamName);
    }
}
