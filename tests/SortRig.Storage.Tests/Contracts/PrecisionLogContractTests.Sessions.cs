using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task OpenOrResume_AfterReopeningTheStore_GivesNextNumberCupCountsAndUnannouncedParts()
    {
        var bench = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(bench);
        string[] cups = ["A", "A", "B", "C", "A"];
        var parts = new List<PartRecord>();
        for (int i = 0; i < cups.Length; i++)
        {
            parts.Add(await Bench.CommitAsync(bench, session.Session.Id, batch, 10_000 + i, cups[i], i));
        }

        foreach (int n in new[] { 1, 2, 4 })
        {
            await bench.MarkAnnouncedAsync(parts[n - 1].Id, CancellationToken.None);
        }

        await bench.DisposeAsync(); // the host "crashes" here
        var reopened = await CreateLogAsync();
        var state = await reopened.OpenOrResumeSessionAsync(new SessionRequest("r2r-ladder-0412"), CancellationToken.None);

        Assert.True(state.Resumed);
        Assert.Equal(session.Session, state.Session);
        Assert.Equal(6, state.NextPartNumber);
        Assert.Equal([new CupCount("A", 3), new CupCount("B", 1), new CupCount("C", 1)], state.CupCounts);
        Assert.Equal([3, 5], state.Unannounced.Select(p => p.Number));
        Assert.Equal(batch, state.CurrentBatch);
        Assert.Equal(6, (await Bench.CommitAsync(reopened, state.Session.Id, batch, 10_000.2)).Number);
    }

    [SkippableFact]
    public async Task OpenOrResume_FinishedSession_StartsANewOne()
    {
        var log = await CreateLogAsync();
        var (first, batch) = await Bench.StartAsync(log);
        await Bench.CommitAsync(log, first.Session.Id, batch, 10_000.1);
        Clock.Advance(TimeSpan.FromHours(3));
        var finished = await log.FinishSessionAsync(first.Session.Id, CancellationToken.None);

        var second = await log.OpenOrResumeSessionAsync(new SessionRequest("r2r-ladder-0412"), CancellationToken.None);

        Assert.Equal(Bench.T0.AddHours(3), finished.FinishedAt);
        Assert.False(second.Resumed);
        Assert.NotEqual(first.Session.Id, second.Session.Id);
        Assert.Equal(1, second.NextPartNumber);
        Assert.Empty(second.CupCounts);
        Assert.Null(second.CurrentBatch);
        Assert.Equal([second.Session.Id, first.Session.Id], (await log.ListSessionsAsync(CancellationToken.None)).Select(s => s.Id));
    }

    [SkippableFact]
    public async Task OpenOrResume_ResumeNotWanted_StartsANewOneBesideTheUnfinished()
    {
        var log = await CreateLogAsync();
        var (first, _) = await Bench.StartAsync(log);

        var second = await log.OpenOrResumeSessionAsync(new SessionRequest("r2r-ladder-0412", ResumeUnfinished: false), CancellationToken.None);
        var resumed = await log.OpenOrResumeSessionAsync(new SessionRequest("r2r-ladder-0412"), CancellationToken.None);

        Assert.False(second.Resumed);
        Assert.Equal(Bench.T0, second.Session.StartedAt);
        Assert.Equal(second.Session.Id, resumed.Session.Id); // the latest unfinished one
        Assert.NotEqual(first.Session.Id, resumed.Session.Id);
    }

    [SkippableFact]
    public async Task RecordRangeTransfer_ThenRead_BatchCarriesTheCorrection()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var correction = new RangeTransferCorrection(10_000, 100_000, -3.5, 0.8, Bench.T0.AddMinutes(5));

        var updated = await log.RecordRangeTransferAsync(batch.Id, correction, CancellationToken.None);

        Assert.Equal(batch with { RangeTransfer = correction }, updated);
        Assert.Equal([updated], await log.GetBatchesAsync(session.Session.Id, CancellationToken.None));
        Assert.Equal(Bench.TenK, updated.Setup);
    }

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
        var moved = await log.UndoPartAsync(new PartCorrection(part2.Id, PartCorrectionKind.MoveToCup, "B", "dropped in B"), CancellationToken.None);
        var countsAfterMove = await log.GetCupCountsAsync(session.Session.Id, CancellationToken.None);
        Clock.Advance(TimeSpan.FromMinutes(1));
        var undone = await log.UndoPartAsync(new PartCorrection(part2.Id, PartCorrectionKind.Undo), CancellationToken.None);

        Assert.Equal("B", moved.CupLabel);
        Assert.Equal([new CupCount("A", 2), new CupCount("B", 1)], countsAfterMove);
        Assert.Equal(PartState.Undone, undone.State);
        Assert.Equal([new CupCount("A", 2)], await log.GetCupCountsAsync(session.Session.Id, CancellationToken.None));
        var history = await log.GetPartHistoryAsync(part2.Id, CancellationToken.None);
        Assert.Equal(
            [(PartEventKind.CupCorrected, "A", "B", Bench.T0.AddMinutes(1)), (PartEventKind.Undone, "Accepted", "Undone", Bench.T0.AddMinutes(2))],
            history.Select(e => (e.Kind, e.Before, e.After, e.At)));
        Assert.Equal("dropped in B", history[0].Note);
        Assert.Equal([1, 2, 3], (await log.GetPartsAsync(session.Session.Id, CancellationToken.None)).Select(p => p.Number));
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
            log.UndoPartAsync(new PartCorrection(part.Id, PartCorrectionKind.Undo), CancellationToken.None));

        Assert.Equal(StorageFault.Conflict, error.Fault);
        Assert.Equal(PartEventKind.Remeasured, Assert.Single(await log.GetPartHistoryAsync(part.Id, CancellationToken.None)).Kind);
        Assert.Equal(PartState.Remeasured, (await log.GetPartAsync(part.Id, CancellationToken.None))!.State);
    }
}
