using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>The check standard (schema version 5): readings numbered per session, parts since the last good
/// check flagged by a check out of control in the same transaction, retries idempotent, flagged parts out of the
/// library.</summary>
public abstract partial class PrecisionLogContractTests
{
    private const string CheckName = "library:ref-10k";

    private static CheckCommit Check(long sessionId, double value, bool inControl, int index = 0, Guid? key = null) =>
        new(
            key ?? Guid.NewGuid(),
            sessionId,
            CheckName,
            Bench.T0.AddMinutes(index),
            value,
            100_000,
            value * 2e-6,
            10_000.0,
            10_000.0,
            0.02,
            inControl,
            inControl ? "None" : "BeyondThreeSigma",
            inControl ? null : "the check read +9.0 sigma from its centre",
            ScaleFactor: 1 - 50e-6
        );

    [SkippableFact]
    public async Task Check_Recorded_ReadsBackWithSeqAndPartNumberAndGain()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        var first = await log.RecordCheckAsync(Check(id, 10_000.1, true), CancellationToken.None);
        await Bench.CommitAsync(log, id, batch, Bench.TenKAt(120), index: 1);
        await Bench.CommitAsync(log, id, batch, Bench.TenKAt(-80), index: 2);
        var second = await log.RecordCheckAsync(Check(id, 10_000.5, true, 3), CancellationToken.None);

        Assert.Equal((1, 0, 0), (first.Seq, first.AfterPartNumber, first.FlaggedCount));
        Assert.Equal((2, 2), (second.Seq, second.AfterPartNumber));
        Assert.Equal(50, second.GainPpm!.Value, 6); // 10 000.5 / 10 000 - 1 = 50e-6
        Assert.Equal(10_000.5 * (1 - 50e-6), second.Commit.ScaledOhms, 9);
        await log.DisposeAsync();
        var reopened = await CreateLogAsync();
        var checks = await reopened.GetSessionChecksAsync(id, CancellationToken.None);
        Assert.Equal([first, second], checks);
        Assert.Equal(Bench.T0.AddMinutes(3), checks[1].Commit.At);
    }

    [SkippableFact]
    public async Task Check_OutOfControl_FlagsOnlyLivePartsSinceLastGoodCheck_AndKeepsThemOutOfTheLibrary()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        var before = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(10), index: 1);
        await log.RecordCheckAsync(Check(id, 10_000.0, true, 2), CancellationToken.None);
        var p2 = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(20), index: 3);
        var p3 = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(30), index: 4);
        var undone = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(40), index: 5);
        await log.UndoPartAsync(new PartCorrection(undone.Id, PartCorrectionKind.Undo), CancellationToken.None);

        var bad = await log.RecordCheckAsync(Check(id, 10_000.9, false, 6), CancellationToken.None);

        Assert.False(bad.Commit.InControl);
        Assert.Equal(2, bad.FlaggedCount); // p2, p3; not the part before the good check, not the undone one
        Assert.Equal([p2.Id, p3.Id], await log.GetSuspectPartsAsync(id, CancellationToken.None));
        var library = await log.FindPartsAsync(new LibraryQuery(), CancellationToken.None);
        Assert.Equal([before.Id], library.Select(p => p.Id));
        var read = await log.GetPartsAsync(id, CancellationToken.None);
        Assert.Equal([p2.Id, p3.Id], read.Where(p => p.Suspect).Select(p => p.Id)); // the record says it too

        // Measured again: the flagged record becomes Remeasured and is no longer suspect.
        await log.UndoPartAsync(new PartCorrection(p2.Id, PartCorrectionKind.Remeasure), CancellationToken.None);
        Assert.Equal([p3.Id], await log.GetSuspectPartsAsync(id, CancellationToken.None));
        Assert.False((await log.GetPartAsync(p2.Id, CancellationToken.None))!.Suspect);
        Assert.Equal([p2.Id, p3.Id], await log.GetFlaggedPartsAsync(id, CancellationToken.None));

        // A second check out of control flags nothing twice.
        var again = await log.RecordCheckAsync(Check(id, 10_001.0, false, 7), CancellationToken.None);
        Assert.Equal(0, again.FlaggedCount);
    }

    [SkippableFact]
    public async Task Check_RetriedWithSameKey_WritesAndFlagsNothingTwice()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        await Bench.CommitAsync(log, id, batch, Bench.TenKAt(5), index: 1);
        var commit = Check(id, 10_001.0, false, 2);

        var first = await log.RecordCheckAsync(commit, CancellationToken.None);
        var retry = await log.RecordCheckAsync(commit, CancellationToken.None);

        Assert.Equal(first, retry);
        Assert.Equal(1, first.FlaggedCount);
        Assert.Single(await log.GetSessionChecksAsync(id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task CheckHistory_AcrossSessions_OldestFirstNewestKept()
    {
        var log = await CreateLogAsync();
        var (one, _) = await Bench.StartAsync(log, "monday");
        await log.RecordCheckAsync(Check(one.Session.Id, 10_000.1, true, 0), CancellationToken.None);
        await log.RecordCheckAsync(Check(one.Session.Id, 10_000.2, true, 1), CancellationToken.None);
        await log.FinishSessionAsync(one.Session.Id, CancellationToken.None);
        var (two, _) = await Bench.StartAsync(log, "tuesday");
        await log.RecordCheckAsync(Check(two.Session.Id, 10_000.3, true, 2), CancellationToken.None);

        var newestTwo = await log.GetCheckHistoryAsync(CheckName, 2, CancellationToken.None);

        Assert.Equal([10_000.2, 10_000.3], newestTwo.Select(c => c.Commit.ValueOhms));
        Assert.Equal(1, (await log.GetSessionChecksAsync(two.Session.Id, CancellationToken.None)).Single().Seq);
        Assert.Empty(await log.GetCheckHistoryAsync("channel:9", 10, CancellationToken.None));
    }

    [SkippableFact]
    public async Task Check_FinishedSessionOrBadValue_Refused()
    {
        var log = await CreateLogAsync();
        var (session, _) = await Bench.StartAsync(log);
        await log.FinishSessionAsync(session.Session.Id, CancellationToken.None);

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            log.RecordCheckAsync(Check(session.Session.Id, 10_000, true), CancellationToken.None)
        );
        Assert.Equal(StorageFault.Conflict, error.Fault);
        var bad = await Assert.ThrowsAnyAsync<ArgumentException>(() =>
            log.RecordCheckAsync(Check(session.Session.Id, double.NaN, true), CancellationToken.None)
        );
        Assert.Contains("ValueOhms", bad.Message, StringComparison.Ordinal);
    }
}
