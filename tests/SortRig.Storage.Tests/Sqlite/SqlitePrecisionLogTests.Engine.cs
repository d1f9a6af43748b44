using Microsoft.Data.Sqlite;
using SortRig.Storage.Contracts;
using SortRig.Storage.Tests.Contracts;

namespace SortRig.Storage.Tests.Sqlite;

public sealed partial class SqlitePrecisionLogTests
{
    [Fact]
    public async Task Open_NewFile_UsesWalJournalAndPassesSqliteIntegrityCheck()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        for (int i = 0; i < 20; i++)
        {
            await Bench.CommitAsync(log, session.Session.Id, batch, 10_000 + i, "A", i);
        }

        // Checked by SQLite itself on a separate connection (https://sqlite.org/pragma.html#pragma_integrity_check).
        Assert.Equal("wal", await ScalarAsync("PRAGMA journal_mode"));
        Assert.Equal("ok", await ScalarAsync("PRAGMA integrity_check"));
        Assert.Null(await ScalarAsync("PRAGMA foreign_key_check"));
    }

    [Fact]
    public async Task CommitPart_FileLockedByAnotherWriter_ThrowsLockedAndWritesNothing()
    {
        var log = await CreateLogAsync(Options);
        var (session, batch) = await Bench.StartAsync(log);
        var patient = await CreateLogAsync(
            new PrecisionLogOptions { TimeProvider = Clock, BusyTimeout = TimeSpan.FromSeconds(1) }
        );
        await using (var holder = new SqliteConnection($"Data Source={FilePath};Pooling=False"))
        {
            await holder.OpenAsync();
            await using var begin = holder.CreateCommand();
            begin.CommandText = "BEGIN EXCLUSIVE";
            await begin.ExecuteNonQueryAsync();

            var error = await Assert.ThrowsAsync<StorageException>(() =>
                Bench.CommitAsync(patient, session.Session.Id, batch, 10_000.1)
            );

            Assert.Equal((StorageFault.Locked, "commit part"), (error.Fault, error.Operation));
            Assert.Contains(FilePath, error.Message, StringComparison.Ordinal);
        }

        Assert.Empty(await log.GetPartsAsync(session.Session.Id, CancellationToken.None));
        Assert.Equal(1, (await Bench.CommitAsync(patient, session.Session.Id, batch, 10_000.1)).Number);
    }

    [Fact]
    public async Task CommitPart_DatabaseFull_ThrowsDiskFullAndLeavesNothingHalfWritten()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        await Bench.CommitAsync(log, session.Session.Id, batch, 10_000.1);
        long pages = (long)(await ScalarAsync("PRAGMA page_count"))!;
        var cramped = await CreateLogAsync(
            new PrecisionLogOptions { TimeProvider = Clock, SqliteMaxPageCount = pages + 2 }
        );
        // needs far more than two 4 KiB pages
        var big = Bench.Part(session.Session.Id, batch, 10_000.2, readings: 5_000);

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            cramped.CommitPartAsync(big, CancellationToken.None)
        );

        Assert.Equal(StorageFault.DiskFull, error.Fault);
        Assert.Equal([1], (await log.GetPartsAsync(session.Session.Id, CancellationToken.None)).Select(p => p.Number));
        Assert.Equal(
            0L,
            await ScalarAsync("SELECT COUNT(*) FROM raw_readings WHERE part_id <> (SELECT MIN(id) FROM parts)")
        );
        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
        Assert.Equal(2, (await Bench.CommitAsync(log, session.Session.Id, batch, 10_000.2)).Number);
    }

    [Fact]
    public async Task Open_FileIsNotADatabase_ThrowsCorrupt()
    {
        await File.WriteAllTextAsync(FilePath, "this is a bench note, not a database file; " + new string('x', 4096));

        var error = await Assert.ThrowsAsync<StorageException>(() => CreateLogAsync());

        Assert.Equal(StorageFault.Corrupt, error.Fault);
    }

    [Fact]
    public async Task Open_DirectoryMissing_ThrowsUnavailableNamingThePath()
    {
        var path = Path.Combine(_directory, "no-such-dir", "precision.db");

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            PrecisionLogFactory.OpenAsync(path, Options, CancellationToken.None)
        );

        Assert.Equal(StorageFault.Unavailable, error.Fault);
        Assert.Contains(path, error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Factory_BarePath_OpensSqliteFile()
    {
        var log = await TrackAsync(PrecisionLogFactory.OpenAsync(FilePath, Options, CancellationToken.None));

        Assert.Equal(StorageEngine.Sqlite, log.Engine);
        Assert.True(File.Exists(FilePath));
    }
}
