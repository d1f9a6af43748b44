using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task Writes_ReadOnlyStore_ThrowStorageExceptionNamingTheOperationAndWriteNothing()
    {
        var writer = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(writer);
        var readOnly = await TrackAsync(OpenReadOnlyLogAsync());

        var commit = await Assert.ThrowsAsync<StorageException>(() =>
            Bench.CommitAsync(readOnly, session.Session.Id, batch, 10_000.1)
        );
        var open = await Assert.ThrowsAsync<StorageException>(() =>
            readOnly.OpenOrResumeSessionAsync(new SessionRequest("another"), CancellationToken.None)
        );

        Assert.Equal((StorageFault.ReadOnly, "commit part"), (commit.Fault, commit.Operation));
        Assert.Equal((StorageFault.ReadOnly, "open or resume session"), (open.Fault, open.Operation));
        Assert.Contains("read-only", commit.Message, StringComparison.Ordinal);
        Assert.Single(await readOnly.ListSessionsAsync(CancellationToken.None));
        Assert.Empty(await writer.GetPartsAsync(session.Session.Id, CancellationToken.None));
        Assert.Equal(1, (await Bench.CommitAsync(writer, session.Session.Id, batch, 10_000.1)).Number);
    }

    [SkippableFact]
    public async Task Operations_AfterDispose_ThrowObjectDisposed()
    {
        var log = await CreateLogAsync();
        await log.DisposeAsync();

        await Assert.ThrowsAsync<ObjectDisposedException>(() => log.ListSessionsAsync(CancellationToken.None));
    }
}
