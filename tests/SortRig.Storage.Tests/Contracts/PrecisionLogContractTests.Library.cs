using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    /// <summary>Commits 10 kOhm parts at the given deviations (ppm) into one session; returns them in the same
    /// order.</summary>
    private async Task<List<PartRecord>> StockLibraryAsync(IPrecisionLog log, params double[] deviationsPpm)
    {
        var (session, batch) = await Bench.StartAsync(log, "library-stock");
        var parts = new List<PartRecord>();
        for (int i = 0; i < deviationsPpm.Length; i++)
        {
            parts.Add(await Bench.CommitAsync(log, session.Session.Id, batch, Bench.TenKAt(deviationsPpm[i]), "A", i));
        }

        return parts;
    }

    [SkippableFact]
    public async Task FindParts_ByNominalDeviationStatusAndLocation_ReturnsMatchingLivePartsByDeviation()
    {
        var log = await CreateLogAsync();
        var p = await StockLibraryAsync(log, 80, -120, 15, -30, 450, 40);
        var (other, twentyK) = await Bench.StartAsync(log, "other", Bench.TwentyK);
        await Bench.CommitAsync(log, other.Session.Id, twentyK, 20_000.2);
        await log.UndoPartAsync(new PartCorrection(p[5].Id, PartCorrectionKind.Undo), CancellationToken.None);
        await log.SetLocationAsync(p[0].Id, "drawer 3/box 10k", CancellationToken.None);
        await log.SetLocationAsync(p[2].Id, "drawer 3/box 10k", CancellationToken.None);
        await log.TakePartsAsync([p[3].Id], "bench-2", CancellationToken.None);

        var window = await log.FindPartsAsync(new LibraryQuery(10_000, -50, 100, Status: null), CancellationToken.None);
        var available = await log.FindPartsAsync(new LibraryQuery(10_000, -50, 100), CancellationToken.None);
        var drawer = await log.FindPartsAsync(new LibraryQuery(Location: "drawer 3/box 10k"), CancellationToken.None);
        var taken = await log.FindPartsAsync(new LibraryQuery(Status: LibraryStatus.Taken), CancellationToken.None);
        var all = await log.FindPartsAsync(new LibraryQuery(Status: null), CancellationToken.None);

        Assert.Equal([p[3].Id, p[2].Id, p[0].Id], window.Select(x => x.Id)); // -30, 15, 80 ppm; 40 ppm part was undone
        Assert.Equal([p[2].Id, p[0].Id], available.Select(x => x.Id));
        Assert.Equal([p[2].Id, p[0].Id], drawer.Select(x => x.Id));
        Assert.Equal("bench-2", Assert.Single(taken).TakenBy);
        Assert.Equal(6, all.Count); // 5 live 10k parts + one 20k part
    }

    [SkippableFact]
    public async Task TakeParts_SecondTakeOverlapsFirst_RefusesAllAndTakesNone()
    {
        var log = await CreateLogAsync();
        var p = await StockLibraryAsync(log, 10, 20, 30);

        var first = await log.TakePartsAsync([p[0].Id, p[1].Id], "bench-1", CancellationToken.None);
        var second = await log.TakePartsAsync([p[1].Id, p[2].Id], "bench-2", CancellationToken.None);

        Assert.True(first.Succeeded);
        Assert.Equal(["bench-1", "bench-1"], first.Changed.Select(x => x.TakenBy));
        Assert.False(second.Succeeded);
        Assert.Empty(second.Changed);
        Assert.Equal([p[1].Id], second.Refused);
        var untouched = await log.GetPartAsync(p[2].Id, CancellationToken.None);
        Assert.Equal((LibraryStatus.Available, (string?)null), (untouched!.LibraryStatus, untouched.TakenBy));
        Assert.Empty(await log.GetPartHistoryAsync(p[2].Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task LibraryLifecycle_TakeUseRetire_RecordsEachStepWithItsActor()
    {
        var log = await CreateLogAsync();
        var p = await StockLibraryAsync(log, 10, 20);
        var unknownId = p[1].Id + 1000;

        await log.TakePartsAsync([p[0].Id], "bench-1", CancellationToken.None);
        var used = await log.MarkUsedAsync([p[0].Id], "DAC board rev B #4", CancellationToken.None);
        var releaseUsed = await log.ReleasePartsAsync([p[0].Id], CancellationToken.None);
        var retired = await log.RetireAsync([p[0].Id], "board scrapped", CancellationToken.None);
        var withUnknown = await log.TakePartsAsync([p[1].Id, unknownId], "bench-1", CancellationToken.None);

        Assert.Equal((LibraryStatus.Used, "bench-1"), (used.Changed[0].LibraryStatus, used.Changed[0].TakenBy));
        Assert.Equal([p[0].Id], releaseUsed.Refused);
        Assert.Equal(LibraryStatus.Retired, Assert.Single(retired.Changed).LibraryStatus);
        Assert.Equal([unknownId], withUnknown.Refused);
        Assert.Equal(LibraryStatus.Available, (await log.GetPartAsync(p[1].Id, CancellationToken.None))!.LibraryStatus);
        Assert.Equal(
            [
                (PartEventKind.Taken, "Available", "Taken", "bench-1", (string?)null),
                (PartEventKind.Used, "Taken", "Used", null, "DAC board rev B #4"),
                (PartEventKind.Retired, "Used", "Retired", null, "board scrapped"),
            ],
            (await log.GetPartHistoryAsync(p[0].Id, CancellationToken.None)).Select(e =>
                (e.Kind, e.Before, e.After, e.Actor, e.Note)
            )
        );
    }

    [SkippableFact]
    public async Task SetLocation_MovedTwice_KeepsEachMoveInHistory()
    {
        var log = await CreateLogAsync();
        var p = await StockLibraryAsync(log, 10);

        await log.SetLocationAsync(p[0].Id, "tray 1", CancellationToken.None);
        var moved = await log.SetLocationAsync(p[0].Id, "tray 2", CancellationToken.None);

        Assert.Equal("tray 2", moved.Location);
        Assert.Equal(
            [
                (PartEventKind.Relocated, (string?)null, (string?)"tray 1"),
                (PartEventKind.Relocated, "tray 1", "tray 2"),
            ],
            (await log.GetPartHistoryAsync(p[0].Id, CancellationToken.None)).Select(e => (e.Kind, e.Before, e.After))
        );
    }
}
