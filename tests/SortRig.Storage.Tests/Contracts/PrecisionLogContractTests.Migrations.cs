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

        Assert.Equal("initial", Assert.Single(EngineMigrations).Name); // one script shipped so far: 0001_initial.sql
        Assert.Equal(1, report.SchemaVersion);
        Assert.Equal(1, await SchemaVersionRowsAsync());
        Assert.True(report.IsOk, string.Join("; ", report.Problems));
        Assert.Equal(part, await second.GetPartAsync(part.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task Open_TwoInstancesOnEmptyStoreAtOnce_BothOpenAndMigrateOnce()
    {
        var both = await Task.WhenAll(Task.Run(() => CreateLogAsync()), Task.Run(() => CreateLogAsync()));

        Assert.Equal(1, await SchemaVersionRowsAsync());
        Assert.Equal(1, (await both[1].VerifyAsync(CancellationToken.None)).SchemaVersion);
        var (a, _) = await Bench.StartAsync(both[0], "bench-A");
        var (b, _) = await Bench.StartAsync(both[1], "bench-B");
        Assert.NotEqual(a.Session.Id, b.Session.Id);
    }

    [SkippableFact]
    public async Task Open_SecondMigrationFailsHalfway_StoreStaysAtFirstVersion()
    {
        var broken = new Migration(2, "broken", "CREATE TABLE half_done (x INTEGER); CREATE TABLE this is not sql;");

        var error = await Assert.ThrowsAsync<StorageException>(() => OpenWithMigrationsAsync([EngineMigrations[0], broken]));
        var log = await CreateLogAsync();

        Assert.Equal(StorageFault.Schema, error.Fault);
        Assert.Contains("version 1", error.Message, StringComparison.Ordinal);
        Assert.False(await TableExistsAsync("half_done"));
        Assert.True(await TableExistsAsync("parts"));
        Assert.Equal(1, (await log.VerifyAsync(CancellationToken.None)).SchemaVersion);
    }

    [SkippableFact]
    public async Task Open_StoreNewerThanBuild_ThrowsSchemaFault()
    {
        var newer = new Migration(2, "future", "CREATE TABLE future_feature (x INTEGER);");
        await TrackAsync(OpenWithMigrationsAsync([EngineMigrations[0], newer]));

        var error = await Assert.ThrowsAsync<StorageException>(() => CreateLogAsync());

        Assert.Equal(StorageFault.Schema, error.Fault);
        Assert.Contains("version 2", error.Message, StringComparison.Ordinal);
    }
}
