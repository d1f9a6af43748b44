using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Postgres;

public sealed partial class PostgresPrecisionLogTests
{
    [Fact]
    public async Task Open_NoServerListening_ThrowsUnavailableNamingTheServer()
    {
        // Port 1 on loopback: nothing listens there, the connect is refused at once. Needs no test server.
        var error = await Assert.ThrowsAsync<StorageException>(() =>
            PrecisionLogFactory.OpenAsync(
                "Host=127.0.0.1;Port=1;Username=bench;Database=sortrig;Timeout=3",
                Options,
                CancellationToken.None
            )
        );

        Assert.Equal(StorageFault.Unavailable, error.Fault);
        Assert.Contains("127.0.0.1:1/sortrig", error.Message, StringComparison.Ordinal);
    }

    [SkippableFact]
    public async Task Factory_HostConnectionString_OpensPostgres()
    {
        var log = await TrackAsync(
            PrecisionLogFactory.OpenAsync(await StoreConnectionStringAsync(), Options, CancellationToken.None)
        );

        Assert.Equal(StorageEngine.Postgres, log.Engine);
        Assert.True(await TableExistsAsync("parts"));
    }
}
