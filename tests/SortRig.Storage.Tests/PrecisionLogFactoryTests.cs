using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests;

public sealed class PrecisionLogFactoryTests
{
    [Theory]
    [InlineData("Data Source=/var/lib/sortrig/precision.db", StorageEngine.Sqlite)]
    [InlineData("DataSource=precision.db;Mode=ReadOnly", StorageEngine.Sqlite)]
    [InlineData("Filename=bench.db", StorageEngine.Sqlite)]
    [InlineData("/var/lib/sortrig/precision.db", StorageEngine.Sqlite)]
    [InlineData("precision.db", StorageEngine.Sqlite)]
    [InlineData("Host=127.0.0.1;Port=55432;Username=sortrig;Database=sortrig_test", StorageEngine.Postgres)]
    [InlineData("host=lab-db.local;database=library", StorageEngine.Postgres)]
    [InlineData("Server=10.0.0.5;Database=library", StorageEngine.Postgres)]
    public void DetectEngine_ConnectionString_PicksEngine(string connectionString, StorageEngine expected) =>
        Assert.Equal(expected, PrecisionLogFactory.DetectEngine(connectionString));

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData("Database=library;Username=bench")]
    [InlineData("Host=;=;;x")]
    public void DetectEngine_NoEngineNamed_ThrowsArgumentSayingWhatIsExpected(string connectionString)
    {
        var error = Assert.Throws<ArgumentException>(() => PrecisionLogFactory.DetectEngine(connectionString));

        Assert.Equal("connectionString", error.ParamName);
        Assert.Contains("Data Source=", error.Message, StringComparison.Ordinal);
        Assert.Contains("Host=", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task OpenAsync_InMemorySqlite_RefusedAsNotDurable()
    {
        var error = await Assert.ThrowsAsync<ArgumentException>(() =>
            PrecisionLogFactory.OpenAsync("Data Source=:memory:", null, CancellationToken.None)
        );

        Assert.Contains("in-memory", error.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("/dev/null", "is a device")]
    [InlineData("Data Source=/dev/zero", "is a device")]
    [InlineData("/tmp", "is a folder")]
    public async Task OpenAsync_DeviceOrFolderAsSqlite_RefusedAndNoJournalLeftBeside(string database, string said)
    {
        var error = await Assert.ThrowsAsync<ArgumentException>(() =>
            PrecisionLogFactory.OpenAsync(database, null, CancellationToken.None)
        );

        Assert.Contains(said, error.Message, StringComparison.Ordinal);
        var path = database.Replace("Data Source=", "", StringComparison.Ordinal);
        Assert.All(new[] { "-journal", "-wal", "-shm" }, suffix =>
            Assert.False(File.Exists(path + suffix), path + suffix)
        );
    }

    [Theory]
    [InlineData("/nonexistent-sortrig/x.db", "the folder '/nonexistent-sortrig' does not exist")]
    // procfs refuses new files, even to root (common practice, no source)
    [InlineData("/proc/sortrig.db", "the folder '/proc' is not writable")]
    public void CheckTarget_FolderMissingOrNotWritable_UnavailableSayingWhy_NothingCreated(string database, string said)
    {
        var error = Assert.Throws<StorageException>(() => PrecisionLogFactory.CheckTarget(database));

        Assert.Equal(StorageFault.Unavailable, error.Fault);
        Assert.Contains(said, error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(database));
    }

    [Fact]
    public void CheckTarget_FileOnTheSharedMemoryFileSystem_IsAnOrdinaryFile()
    {
        // /dev/shm is a tmpfs on Linux (common practice, no source): a database there is a regular file.
        Assert.True(Directory.Exists("/dev/shm"), "this test needs Linux's /dev/shm");

        PrecisionLogFactory.CheckTarget($"/dev/shm/sortrig-check-{Guid.NewGuid():N}.db");
    }

    [Theory]
    [InlineData(0.5)]
    [InlineData(601)]
    public void Options_BusyTimeoutOutOfRange_ThrowsNamingTheOption(double seconds)
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() =>
            new PrecisionLogOptions { BusyTimeout = TimeSpan.FromSeconds(seconds) }
        );

        Assert.Equal("BusyTimeout", error.ParamName);
    }

    [Fact]
    public void Options_NegativeRetries_ThrowsNamingTheOption() =>
        Assert.Equal(
            "TransientRetries",
            Assert
                .Throws<ArgumentOutOfRangeException>(() => new PrecisionLogOptions { TransientRetries = -1 })
                .ParamName
        );
}
