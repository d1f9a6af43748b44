using SortRig.Engine.Sorting;
using SortRig.Engine.Tests.Reliability.Support;
using SortRig.Simulator;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;
using SortRig.Storage;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Engine.Tests.Reliability;

/// <summary>
/// Breaks in the stream of readings: a part swapped while the meter was away, and the process
/// stalled while a part settled. Each provoked on purpose on the real simulator.
/// </summary>
[Collection(ReliabilityCollection.Name)]
[Trait(ReliabilityCollection.Clock, ReliabilityCollection.Wall)]
public sealed class ReadingContinuityTests(ITestOutputHelper output) : IDisposable
{
    private static readonly TimeSpan s_limit = TimeSpan.FromSeconds(60);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-continuity-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task PartSwappedWhileMeterAway_NewPartIsMeasuredAndAnnounced()
    {
        var sort = new InProcessSort(Options(parts: 2, speed: 50));
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(b => b with { Operator = b.Operator with { Mode = OperatorMode.Manual } }, cts.Token);
        var bench = await sort.Bench;
        await SwapDuringOutageAsync(sort, bench);

        var outcome = await run;

        Assert.Equal(2, outcome.PartsRecorded);
        Assert.Contains(
            "a new part went in before the fixture was seen empty",
            sort.Ears.Text,
            StringComparison.Ordinal
        );
        await using var log = await PrecisionLogFactory.OpenAsync(sort.Options.Database, null, default);
        var second = (await log.GetPartsAsync(outcome.SessionId, default))[1];
        Assert.InRange(
            second.Value,
            bench.Truth(1) - second.Measured.Expanded,
            bench.Truth(1) + second.Measured.Expanded
        );
    }

    [Fact]
    public async Task LookAlikePartSwappedWhileMeterAway_MeasuredOnceItStaysIn()
    {
        // A reel of parts a few ppm apart (sigma 5 ppm), no tempco: values cannot tell them apart.
        var sort = new InProcessSort(Options(parts: 2, speed: 50));
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(
            b =>
                b with
                {
                    Operator = b.Operator with { Mode = OperatorMode.Manual },
                    Reel = b.Reel with
                    {
                        TolerancePercent = 0.01,
                        Distribution = ValueDistribution.Normal(0.05),
                        TempcoSigmaPpmPerKelvin = 0,
                    },
                },
            cts.Token
        );
        var bench = await sort.Bench;
        Assert.InRange(Math.Abs(bench.Truth(1) - bench.Truth(0)) / bench.Truth(0) * 1e6, 0, 20);
        await SwapDuringOutageAsync(sort, bench);

        var outcome = await run;

        Assert.Equal(2, outcome.PartsRecorded);
        Assert.Contains(
            "a part is still in the fixture after the meter came back",
            sort.Ears.Text,
            StringComparison.Ordinal
        );
    }

    [Fact]
    public async Task PartSwappedWithinOneReading_NewPartIsMeasured()
    {
        // A quick hand: the fixture is empty for one reading only (the tracker wants two overloads
        // in a row to call it a removal) before the next part goes in. No meter fault at all.
        var sort = new InProcessSort(Options(parts: 2, speed: 5));
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(
            b => b with { Operator = b.Operator with { Mode = OperatorMode.Manual }, ContactBounce = TimeSpan.Zero },
            cts.Token
        );
        var bench = await sort.Bench;
        var first = sort.Ears.HeardAsync(l => l.StartsWith("part 1: cup", StringComparison.Ordinal), s_limit);
        await InProcessSort.UntilAsync(
            () => sort.Services.Snapshot.Session is not null,
            s_limit,
            "the session to open"
        );
        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 3);
        await first;

        var seen = sort.Services.Hub.History()[^1].Sequence;
        bench.Fixture.Remove();
        await InProcessSort.UntilAsync(
            () => sort.Services.Hub.History().Any(e => e.Sequence > seen && e.Value is double.PositiveInfinity),
            s_limit,
            "one overload reading"
        );
        bench.Fixture.Insert(bench.Reel[1], warmKelvin: 3);

        var outcome = await run;

        output.WriteLine(sort.Ears.Text);
        Assert.Equal(2, outcome.PartsRecorded);
        await using var log = await PrecisionLogFactory.OpenAsync(sort.Options.Database, null, default);
        var second = (await log.GetPartsAsync(outcome.SessionId, default))[1];
        Assert.InRange(
            second.Value,
            bench.Truth(1) - second.Measured.Expanded,
            bench.Truth(1) + second.Measured.Expanded
        );
    }

    [Fact]
    public async Task PartSwappedUnseenInAGapBetweenReadings_NewPartIsMeasured()
    {
        // The part is changed in one move (no reading ever sees the fixture empty) while the
        // readings pause for 2.5 s of bench time (the process was busy): no fault, no overload.
        var clock = new SteppedClock();
        var sort = new InProcessSort(Options(parts: 2, speed: 5), clock);
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(
            b => b with { Operator = b.Operator with { Mode = OperatorMode.Manual }, ContactBounce = TimeSpan.Zero },
            cts.Token
        );
        var bench = await sort.Bench;
        var first = sort.Ears.HeardAsync(l => l.StartsWith("part 1: cup", StringComparison.Ordinal), s_limit);
        await InProcessSort.UntilAsync(
            () => sort.Services.Snapshot.Session is not null,
            s_limit,
            "the session to open"
        );
        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 3);
        await first;

        bench.Fixture.Remove();
        bench.Fixture.Insert(bench.Reel[1], warmKelvin: 3);
        clock.Step(TimeSpan.FromSeconds(0.5));

        var outcome = await run;

        output.WriteLine(sort.Ears.Text);
        Assert.Equal(2, outcome.PartsRecorded);
    }

    [Fact]
    public async Task HostStalledWhileSettling_PartMeasuredAgainNotDeclaredUnstable()
    {
        // The process stalls for 1 s of wall time (50 s on the bench clock, past the 40 s allowed to
        // settle) while a part is settling: the readings around the gap do not describe one settling.
        var clock = new SteppedClock();
        var sort = new InProcessSort(Options(parts: 1, speed: 50), clock);
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(null, cts.Token);
        await InProcessSort.UntilAsync(
            () => sort.Services.Hub.History().Any(e => e.State == "Settling"),
            s_limit,
            "a settling reading"
        );

        clock.Step(TimeSpan.FromSeconds(1));
        var outcome = await run;

        Assert.Equal(0, outcome.Unstable);
        Assert.Equal(1, outcome.Accepted);
        Assert.Contains("measuring the part again", sort.Ears.Text, StringComparison.Ordinal);
    }

    // Part 0 goes in and is announced; then the next reply is held back 30 s, so the loop times out
    // and reconnects, and meanwhile part 0 is taken out and part 1 put in: the loop never reads the
    // empty fixture.
    private static async Task SwapDuringOutageAsync(InProcessSort sort, SimulatedBench bench)
    {
        var first = sort.Ears.HeardAsync(l => l.StartsWith("part 1: cup", StringComparison.Ordinal), s_limit);
        await InProcessSort.UntilAsync(
            () => sort.Services.Snapshot.Session is not null,
            s_limit,
            "the session to open"
        );

        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 3);
        await first;

        bench.Faults.ReplyDelay = TimeSpan.FromSeconds(30);
        bench.Faults.Inject(FaultKind.DelayReply);
        await InProcessSort.UntilAsync(
            () => bench.Faults.Log.Count(FaultKind.DelayReply) > 0,
            s_limit,
            "the delayed reply"
        );

        bench.Fixture.Remove();
        bench.Fixture.Insert(bench.Reel[1], warmKelvin: 3);
    }

    private SortOptions Options(int parts, double speed) =>
        new()
        {
            Database = Path.Combine(_dir, $"{Guid.NewGuid():N}.db"),
            Session = "recover",
            Parts = parts,
            Seed = 515,
            Speed = speed,
            Nplc = 10,
            Speech = false,
            Live = false,
        };
}
