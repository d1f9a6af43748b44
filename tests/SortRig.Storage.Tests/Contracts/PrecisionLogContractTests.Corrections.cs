using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task UndoPart_CupCorrectionThenUndo_KeepsHistoryAndCountsOnlyLiveParts()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        for (int i = 0; i < 3; i++)
        {
            await Bench.CommitAsync(log, session.Session.Id, batch, 10_000 + i, "A", i);
        }

        var part2 = (await log.GetPartsAsync(session.Session.Id, CancellationToken.None))[1];
        Clock.Advance(TimeSpan.FromMinutes(1));
        var moved = await log.UndoPartAsync(
            new PartCorrection(part2.Id, PartCorrectionKind.MoveToCup, "B", "dropped in B"),
            CancellationToken.None
        );
        var countsAfterMove = await log.GetCupCountsAsync(session.Session.Id, CancellationToken.None);
        Clock.Advance(TimeSpan.FromMinutes(1));
        var undone = await log.UndoPartAsync(
            new PartCorrection(part2.Id, PartCorrectionKind.Undo),
            CancellationToken.None
        );

        Assert.Equal("B", moved.CupLabel);
        Assert.Equal([new CupTally("A", 2), new CupTally("B", 1)], countsAfterMove);
        Assert.Equal(PartState.Undone, undone.State);
        Assert.Equal([new CupTally("A", 2)], await log.GetCupCountsAsync(session.Session.Id, CancellationToken.None));
        var history = await log.GetPartHistoryAsync(part2.Id, CancellationToken.None);
        Assert.Equal(
            [
                (PartEventKind.CupCorrected, "A", "B", Bench.T0.AddMinutes(1)),
                (PartEventKind.Undone, "Accepted", "Undone", Bench.T0.AddMinutes(2)),
            ],
            history.Select(e => (e.Kind, e.Before, e.After, e.At))
        );
        Assert.Equal("dropped in B", history[0].Note);
        Assert.Equal(
            [1, 2, 3],
            (await log.GetPartsAsync(session.Session.Id, CancellationToken.None)).Select(p => p.Number)
        );
        Assert.Equal(4, (await Bench.CommitAsync(log, session.Session.Id, batch, 10_001)).Number);
        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
    }

    [SkippableFact]
    public async Task UndoPart_AlreadyUndone_ThrowsConflictAndAddsNoHistory()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var part = await Bench.CommitAsync(log, session.Session.Id, batch, 10_000.1);
        await log.UndoPartAsync(new PartCorrection(part.Id, PartCorrectionKind.Remeasure), CancellationToken.None);

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            log.UndoPartAsync(new PartCorrection(part.Id, PartCorrectionKind.Undo), CancellationToken.None)
        );

        Assert.Equal(StorageFault.Conflict, error.Fault);
        Assert.Equal(
            PartEventKind.Remeasured,
            Assert.Single(await log.GetPartHistoryAsync(part.Id, CancellationToken.None)).Kind
        );
        Assert.Equal(PartState.Remeasured, (await log.GetPartAsync(part.Id, CancellationToken.None))!.State);
    }
}
