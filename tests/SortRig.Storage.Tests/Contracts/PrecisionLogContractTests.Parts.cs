using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    [SkippableFact]
    public async Task CommitPart_ReadBack_ReturnsEveryFieldAsCommitted()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var key = Guid.NewGuid();
        // same instant as 08:15:30.123Z
        var acceptedAt = new DateTimeOffset(2026, 3, 2, 10, 15, 30, 123, TimeSpan.FromHours(2));
        Reading[] readings =
        [
            Reading.Finite(10_000.912, acceptedAt.AddSeconds(-2), 100_000),
            Reading.Overload(acceptedAt.AddSeconds(-1), 100_000),
            Reading.Finite(10_000.85, acceptedAt, 100_000),
        ];
        var commit = new PartCommit(
            key,
            session.Session.Id,
            batch.Id,
            new MeasuredValue(10_000.85, 0.12, 0.015, 2.0),
            100_000,
            10,
            23.1,
            acceptedAt,
            "C+3",
            "T2-07",
            readings
        );

        var stored = await log.CommitPartAsync(commit, CancellationToken.None);

        var expected = new PartRecord(
            stored.Id,
            key,
            session.Session.Id,
            batch.Id,
            1,
            10_000,
            new MeasuredValue(10_000.85, 0.12, 0.015, 2.0),
            100_000,
            10,
            23.1,
            new DateTimeOffset(2026, 3, 2, 8, 15, 30, 123, TimeSpan.Zero),
            "C+3",
            "T2-07",
            PartState.Accepted,
            false,
            null,
            LibraryStatus.Available,
            null
        );
        Assert.Equal(expected, stored);
        Assert.Equal(expected, await log.GetPartAsync(stored.Id, CancellationToken.None));
        Assert.Equal([expected], await log.GetPartsAsync(session.Session.Id, CancellationToken.None));
        Assert.Equal(85, stored.DeviationPpm, 6); // (10 000.85 - 10 000) / 10 000 * 1e6, by hand
        var raw = await log.GetReadingsAsync(stored.Id, CancellationToken.None);
        Assert.Equal(readings.Select((r, i) => new RawReading(stored.Id, i, r.Time, r.Value, r.Range, r.Kind)), raw);
        Assert.Equal(double.PositiveInfinity, raw[1].Value);
    }

    [SkippableFact]
    public async Task CommitPart_ManyParts_NumbersRunFromOneWithoutGaps()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var second = await log.StartBatchAsync(session.Session.Id, Bench.TwentyK, CancellationToken.None);
        for (int i = 0; i < 12; i++)
        {
            await Bench.CommitAsync(
                log,
                session.Session.Id,
                i % 2 == 0 ? batch : second,
                i % 2 == 0 ? 10_000.4 : 20_000.9,
                index: i
            );
        }

        var parts = await log.GetPartsAsync(session.Session.Id, CancellationToken.None);
        Assert.Equal(Enumerable.Range(1, 12), parts.Select(p => p.Number));
        Assert.Equal(6, parts.Count(p => p.Nominal == 20_000));
        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
    }

    [SkippableFact]
    public async Task CommitPart_SameKeyTwice_StoresOneRowAndReturnsTheFirst()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var first = Bench.Part(session.Session.Id, batch, 10_000.4, readings: 4);
        var retry = first with { Measured = new MeasuredValue(10_003, 0.1, 0.01), Readings = [] };

        var a = await log.CommitPartAsync(first, CancellationToken.None);
        var b = await log.CommitPartAsync(retry, CancellationToken.None);
        var next = await Bench.CommitAsync(log, session.Session.Id, batch, 9_999.7);

        Assert.Equal(a, b);
        Assert.Equal(10_000.4, b.Value);
        Assert.Equal(4, (await log.GetReadingsAsync(a.Id, CancellationToken.None)).Count);
        Assert.Equal(
            [1, 2],
            (await log.GetPartsAsync(session.Session.Id, CancellationToken.None)).Select(p => p.Number)
        );
        Assert.Equal(2, next.Number);
    }

    [SkippableFact]
    public async Task CommitPart_BatchOfAnotherSession_ThrowsNotFoundAndUsesNoNumber()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        var (_, otherBatch) = await Bench.StartAsync(log, "decade-divider-07");

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            log.CommitPartAsync(Bench.Part(session.Session.Id, otherBatch, 10_000.1), CancellationToken.None)
        );
        var first = await Bench.CommitAsync(log, session.Session.Id, batch, 10_000.1);

        Assert.Equal(StorageFault.NotFound, error.Fault);
        Assert.Equal("commit part", error.Operation);
        Assert.Equal(1, first.Number);
    }

    [SkippableFact]
    public async Task CommitPart_FinishedSession_ThrowsConflict()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);
        await log.FinishSessionAsync(session.Session.Id, CancellationToken.None);

        var error = await Assert.ThrowsAsync<StorageException>(() =>
            Bench.CommitAsync(log, session.Session.Id, batch, 10_000.1)
        );

        Assert.Equal(StorageFault.Conflict, error.Fault);
        Assert.Empty(await log.GetPartsAsync(session.Session.Id, CancellationToken.None));
    }

    [SkippableFact]
    public async Task CommitPart_ZeroRange_ThrowsArgumentNamingTheField()
    {
        var log = await CreateLogAsync();
        var (session, batch) = await Bench.StartAsync(log);

        var error = await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() =>
            log.CommitPartAsync(
                Bench.Part(session.Session.Id, batch, 10_000.1) with
                {
                    Range = 0,
                },
                CancellationToken.None
            )
        );

        Assert.Equal("Range", error.ParamName);
    }
}
