using SortRig.Storage.Contracts;
using SortRig.Storage.Migrations;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task Open_EmptyStoreThenReopen_MigratesOnceAndKeepsData()
    {
        var first = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(first);
        var part = await Bench.CommitAsync(first, session.Session.Id, batch, 10_000.3);
        await first.DisposeAsync();

        var second = await CreateLogAsync();
        var report = await second.VerifyAsync(CancellationToken.None);

        // Scripts shipped so far: 0001_initial.sql, 0002_drift_by_part.sql, 0003_settle_record.sql,
        // 0004_build_target.sql, 0005_check_standard.sql, 0006_replaced_by.sql, 0007_reel_prior.sql.
        Assert.Equal(
            [
                "initial",
                "drift_by_part",
                "settle_record",
                "build_target",
                "check_standard",
                "replaced_by",
                "reel_prior",
            ],
            EngineMigrations.Select(m => m.Name)
        );
        Assert.Equal(7, report.SchemaVersion);
        Assert.Equal(7, await SchemaVersionRowsAsync());
        Assert.True(report.IsOk, string.Join("; ", report.Problems));
        Assert.Equal(part, await second.GetPartAsync(part.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task Open_TwoInstancesOnEmptyStoreAtOnce_BothOpenAndMigrateOnce()
    {
        var both = await Task.WhenAll(Task.Run(() => CreateLogAsync()), Task.Run(() => CreateLogAsync()));

        Assert.Equal(EngineMigrations.Count, await SchemaVersionRowsAsync());
        Assert.Equal(EngineMigrations.Count, (await both[1].VerifyAsync(CancellationToken.None)).SchemaVersion);
        var (a, _) = await Bench.StartAsync(both[0], "bench-A");
        var (b, _) = await Bench.StartAsync(both[1], "bench-B");
        Assert.NotEqual(a.Session.Id, b.Session.Id);
    }

    [SkippableFact]
    public async Task Open_SecondMigrationFailsHalfway_StoreStaysAtFirstVersion()
    {
        var broken = new Migration(2, "broken", "CREATE TABLE half_done (x INTEGER); CREATE TABLE this is not sql;");

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            OpenWithMigrationsAsync([EngineMigrations[0], broken])
        );
        long versionsAfterFailure = await SchemaVersionRowsAsync();
        bool halfDone = await TableExistsAsync("half_done");
        var log = await CreateLogAsync(); // the shipped scripts then apply from version 1 on

        Assert.Equal(StorageFault.Schema, error.Fault);
        Assert.Contains("version 1", error.Message, StringComparison.Ordinal);
        Assert.Equal(1, versionsAfterFailure);
        Assert.False(halfDone);
        Assert.True(await TableExistsAsync("parts"));
        Assert.Equal(EngineMigrations.Count, (await log.VerifyAsync(CancellationToken.None)).SchemaVersion);
    }

    [SkippableFact]
    public async Task Open_StoreNewerThanBuild_ThrowsSchemaFault()
    {
        int future = EngineMigrations.Count + 1;
        var newer = new Migration(future, "future", "CREATE TABLE future_feature (x INTEGER);");
        await TrackAsync(OpenWithMigrationsAsync([.. EngineMigrations, newer]));

        var error = await Assert.ThrowsAsync<StorageException>(() => CreateLogAsync());

        Assert.Equal(StorageFault.Schema, error.Fault);
        Assert.Contains($"version {future}", error.Message, StringComparison.Ordinal);
    }
}
