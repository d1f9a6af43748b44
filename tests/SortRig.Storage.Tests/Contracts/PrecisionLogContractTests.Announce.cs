using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task MarkAnnounced_TwiceOnAcceptedPart_SetsFlagAndStateOnce()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var part = await Bench.CommitAsync(log, session.Session.Id, batch, 10_000.1);

        await log.MarkAnnouncedAsync(part.Id, CancellationToken.None);
        var again = await log.MarkAnnouncedAsync(part.Id, CancellationToken.None);

        Assert.True(again.Announced);
        Assert.Equal(PartState.Announced, again.State);
        var missing = await Assert.ThrowsAsync<StorageException>(() =>
            log.MarkAnnouncedAsync(part.Id + 1000, CancellationToken.None)
        );
        Assert.Equal(StorageFault.NotFound, missing.Fault);
    }

    [SkippableFact]
    public async Task CommitPart_CancelledToken_ThrowsOperationCanceledNotStorageFault()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        using var cts = new CancellationTokenSource();
        await cts.CancelAsync();

        await Assert.ThrowsAnyAsync<OperationCanceledException>(() =>
            log.CommitPartAsync(Bench.Part(session.Session.Id, batch, 10_000.1), cts.Token)
        );

        Assert.Empty(await log.GetPartsAsync(session.Session.Id, CancellationToken.None));
    }
}
