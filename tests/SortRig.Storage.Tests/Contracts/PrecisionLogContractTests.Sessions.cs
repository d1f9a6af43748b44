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
        var state = await reopened.OpenOrResumeSessionAsync(
            new SessionRequest("r2r-ladder-0412"),
            CancellationToken.None
        );

        Assert.True(state.Resumed);
        Assert.Equal(session.Session, state.Session);
        Assert.Equal(6, state.NextPartNumber);
        Assert.Equal([new CupTally("A", 3), new CupTally("B", 1), new CupTally("C", 1)], state.CupCounts);
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
        Assert.Equal(
            [second.Session.Id, first.Session.Id],
            (await log.ListSessionsAsync(CancellationToken.None)).Select(s => s.Id)
        );
    }

    [SkippableFact]
    public async Task OpenOrResume_FinishedSessionWithReopen_CarriesOnItsNumberingAndBatch()
    {
        var log = await CreateLogAsync();
        var (first, batch) = await Bench.StartAsync(log);
        await Bench.CommitAsync(log, first.Session.Id, batch, 10_000.1);
        await Bench.CommitAsync(log, first.Session.Id, batch, 10_000.2);
        await log.FinishSessionAsync(first.Session.Id, CancellationToken.None);

        var reopened = await log.OpenOrResumeSessionAsync(
            new SessionRequest("r2r-ladder-0412", ReopenFinished: true),
            CancellationToken.None
        );

        Assert.True(reopened.Resumed);
        Assert.Equal(first.Session.Id, reopened.Session.Id);
        Assert.Null(reopened.Session.FinishedAt);
        Assert.Equal(3, reopened.NextPartNumber);
        Assert.Equal(batch, reopened.CurrentBatch);
        Assert.Single(await log.ListSessionsAsync(CancellationToken.None));
    }

    [SkippableFact]
    public async Task OpenOrResume_ReopenWithNoSessionOfThatName_StartsANewOne()
    {
        var log = await CreateLogAsync();

        var state = await log.OpenOrResumeSessionAsync(
            new SessionRequest("decade-divider", ReopenFinished: true),
            CancellationToken.None
        );

        Assert.False(state.Resumed);
        Assert.Equal(1, state.NextPartNumber);
    }

    [SkippableFact]
    public async Task OpenOrResume_ResumeNotWanted_StartsANewOneBesideTheUnfinished()
    {
        var log = await CreateLogAsync();
        var (first, _) = await Bench.StartAsync(log);

        var second = await log.OpenOrResumeSessionAsync(
            new SessionRequest("r2r-ladder-0412", ResumeUnfinished: false),
            CancellationToken.None
        );
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
}
