using SortRig.Storage.Contracts;

namespace SortRig.Storage.Tests.Contracts;

public abstract partial class PrecisionLogContractTests
{
    /// <summary>Invented overnight log: <paramref name="count"/> samples of one channel, 60 s apart from <paramref
    /// name="from"/>.</summary>
    private static StoredDriftSample[] ChannelSamples(long runId, int channel, DateTimeOffset from, int count) =>
        [
            .. Enumerable
                .Range(0, count)
                .Select(i => new StoredDriftSample(
                    runId,
                    channel,
                    from.AddSeconds(60 * i),
                    10_000.05 + (i * 1e-4),
                    null
                )),
        ];

    /// <summary>
    /// Two runs: "night-1" with parts 0 and 1 on channels 0/1, an unassigned channel and a thermometer; "night-2" a day
    /// later with part 1 again (channel 0) and part 2 on a channel that never got a sample. Part 3 was never logged.
    /// </summary>
    private async Task<(List<PartRecord> Parts, DriftRun First, DriftRun Second)> TwoNightsAsync(IPrecisionLog log)
    {
        var parts = await StockLibraryAsync(log, 10, -20, 30, 40);
        var first = await log.StartDriftRunAsync(
            new DriftRunRequest(
                "night-1",
                [
                    new DriftChannel("ch101", parts[0].Id),
                    new DriftChannel("ch102", parts[1].Id),
                    new DriftChannel("ch103"),
                    new DriftChannel("pt100@104"),
                ],
                TimeSpan.FromMinutes(1)
            ),
            CancellationToken.None
        );
        await log.AppendDriftSamplesAsync(
            [
                .. ChannelSamples(first.Id, 0, Bench.T0, 5),
                .. ChannelSamples(first.Id, 1, Bench.T0.AddSeconds(1), 3),
                .. ChannelSamples(first.Id, 2, Bench.T0.AddSeconds(2), 7),
            ],
            CancellationToken.None
        );
        Clock.Advance(TimeSpan.FromDays(1));
        var second = await log.StartDriftRunAsync(
            new DriftRunRequest(
                "night-2",
                [new DriftChannel("ch101", parts[1].Id), new DriftChannel("ch102", parts[2].Id)],
                TimeSpan.FromMinutes(1)
            ),
            CancellationToken.None
        );
        await log.AppendDriftSamplesAsync(ChannelSamples(second.Id, 0, Bench.T0.AddDays(1), 4), CancellationToken.None);
        return (parts, first, second);
    }

    [SkippableFact]
    public async Task PartDriftRuns_All_ListsEveryRunAndChannelOfEachLoggedPartWithItsSampleExtent()
    {
        var log = await CreateLogAsync();
        var (p, first, second) = await TwoNightsAsync(log);
        var day2 = Bench.T0.AddDays(1);

        var runs = await log.GetPartDriftRunsAsync(null, CancellationToken.None);

        // Expected rows written out from the samples appended above (60 s apart, 1 µs stored resolution).
        Assert.Equal(
            [
                new PartDriftRun(
                    p[0].Id,
                    first.Id,
                    "night-1",
                    Bench.T0,
                    0,
                    "ch101",
                    Bench.T0,
                    Bench.T0.AddMinutes(4),
                    5
                ),
                new PartDriftRun(
                    p[1].Id,
                    first.Id,
                    "night-1",
                    Bench.T0,
                    1,
                    "ch102",
                    Bench.T0.AddSeconds(1),
                    Bench.T0.AddSeconds(121),
                    3
                ),
                new PartDriftRun(p[1].Id, second.Id, "night-2", day2, 0, "ch101", day2, day2.AddMinutes(3), 4),
                new PartDriftRun(p[2].Id, second.Id, "night-2", day2, 1, "ch102", null, null, 0),
            ],
            runs
        );
        Assert.Equal(4.0 / 60, runs[0].HoursLogged, 12);
        Assert.Equal(0, runs[3].HoursLogged);
    }

    [SkippableFact]
    public async Task PartDriftRuns_SomeIds_ReturnsOnlyTheirRowsAndNothingForUnloggedOrUnknownParts()
    {
        var log = await CreateLogAsync();
        var (p, first, second) = await TwoNightsAsync(log);

        var some = await log.GetPartDriftRunsAsync([p[3].Id, p[1].Id, p[1].Id, 99_999], CancellationToken.None);
        var none = await log.GetPartDriftRunsAsync([p[3].Id], CancellationToken.None);
        var empty = await log.GetPartDriftRunsAsync([], CancellationToken.None);

        Assert.Equal(
            [(p[1].Id, first.Id, 3L), (p[1].Id, second.Id, 4L)],
            some.Select(r => (r.PartId, r.RunId, r.SampleCount))
        );
        Assert.Empty(none);
        Assert.Empty(empty);
        await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() =>
            log.GetPartDriftRunsAsync([p[0].Id, 0], CancellationToken.None)
        );
    }

    [SkippableFact]
    public async Task PartDriftRuns_MoreIdsThanOneStatementBinds_GivesTheSameRowsInOrder()
    {
        var log = await CreateLogAsync();
        var (p, _, _) = await TwoNightsAsync(log);
        var all = await log.GetPartDriftRunsAsync(null, CancellationToken.None);
        // 2 500 ids span three statements of 1 000 ids; the logged parts sit in the first one, every other id is
        // unknown.
        var ids = Enumerable.Range(1, 2_500).Select(i => (long)i).Reverse().ToArray();

        var many = await log.GetPartDriftRunsAsync(ids, CancellationToken.None);

        Assert.True(p.Max(x => x.Id) < 1000);
        Assert.Equal(all, many);
    }
}
