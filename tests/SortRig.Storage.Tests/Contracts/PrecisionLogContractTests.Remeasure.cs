using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

/// <summary>A part measured again after a check: the new record and the old one marked measured again in one
/// transaction, idempotent by commit key (a retry after a crash writes nothing and marks nothing twice).</summary>
public abstract partial class PrecisionLogContractTests
{
    private const string AgainAs = "measured again after a check as part ";

    [SkippableFact]
    public async Task CommitRemeasure_WritesTheNewPartAndMarksTheOldOne_RetryWritesNothing()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        var old = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(40), index: 1);
        var commit = Bench.Part(id, batch, Bench.TenKAt(-10), cup: "B", index: 2);
        var replaced = new PartCorrection(old.Id, PartCorrectionKind.Remeasure, Note: AgainAs);

        var stored = await log.CommitRemeasureAsync(commit, replaced, CancellationToken.None);
        var again = await log.CommitRemeasureAsync(commit, replaced, CancellationToken.None); // the retry

        Assert.Equal(stored.Id, again.Id);
        Assert.Equal(2, stored.Number);
        var parts = await log.GetPartsAsync(id, CancellationToken.None);
        Assert.Equal(2, parts.Count); // nothing written twice
        Assert.Equal(PartState.Remeasured, parts.Single(p => p.Id == old.Id).State);
        Assert.Equal(stored.Id, parts.Single(p => p.Id == old.Id).ReplacedBy); // the link is a column
        Assert.Null(stored.ReplacedBy);
        var history = await log.GetPartHistoryAsync(old.Id, CancellationToken.None);
        var marks = history.Where(e => e.Kind == PartEventKind.Remeasured).ToList();
        Assert.Single(marks); // marked once
        Assert.Equal(AgainAs + "2", marks[0].Note);
    }

    [SkippableFact]
    public async Task CommitRemeasure_OldPartNotLive_WritesNothing()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        var old = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(40), index: 1);
        await log.UndoPartAsync(new PartCorrection(old.Id, PartCorrectionKind.Undo), CancellationToken.None);
        var commit = Bench.Part(id, batch, Bench.TenKAt(-10), index: 2);

        await Assert.ThrowsAsync<StorageException>(() =>
            log.CommitRemeasureAsync(
                commit,
                new PartCorrection(old.Id, PartCorrectionKind.Remeasure, Note: AgainAs),
                CancellationToken.None
            )
        );

        // The refused correction rolled the new record back with it: one transaction.
        Assert.Single(await log.GetPartsAsync(id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task Migration6_PartMeasuredAgainBeforeTheColumn_GetsItsLinkFromTheHistoryNote()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        long id = session.Session.Id;
        var old = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(40), index: 1);
        var undone = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(5), index: 2);
        var again = await Bench.CommitAsync(log, id, batch, Bench.TenKAt(-10), index: 3);
        // Before version 6 the only link was the note; a correction alone writes the note and no column.
        await log.UndoPartAsync(
            new PartCorrection(old.Id, PartCorrectionKind.Remeasure, Note: AgainAs + "3"),
            CancellationToken.None
        );
        await log.UndoPartAsync(new PartCorrection(undone.Id, PartCorrectionKind.Remeasure), CancellationToken.None);
        Assert.Null((await log.GetPartAsync(old.Id, CancellationToken.None))!.ReplacedBy);

        // The shipped version-6 script's backfill, as a store logged before the column meets it.
        var script = EngineMigrations.Single(m => m.Version == 6).Sql;
        await PlainScalarAsync(script[script.IndexOf("UPDATE parts", StringComparison.Ordinal)..]);

        var parts = await log.GetPartsAsync(id, CancellationToken.None);
        Assert.Equal(again.Id, parts.Single(p => p.Id == old.Id).ReplacedBy);
        Assert.Null(parts.Single(p => p.Id == undone.Id).ReplacedBy); // no note, no link
        Assert.Null(parts.Single(p => p.Id == again.Id).ReplacedBy);
    }
}
