using SortRig.Host.Sorting;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Instruments.Drivers;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Storage;

namespace SortRig.Host.Tests.Reliability;

/// <summary>Single recoveries of the sorting loop, each provoked on purpose on the real simulator.</summary>
[Collection(ReliabilityCollection.Name)]
public sealed class LoopRecoveryTests : IDisposable
{
    private static readonly TimeSpan s_limit = TimeSpan.FromSeconds(60);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-recover-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task PartSwappedWhileMeterAway_NewPartIsMeasuredAndAnnounced()
    {
        var sort = new InProcessSort(Options(parts: 2, speed: 50));
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(b => b with { Operator = b.Operator with { Mode = OperatorMode.Manual } }, cts.Token);
        var bench = await sort.Bench;
        var first = sort.Ears.HeardAsync(l => l.StartsWith("part 1: cup", StringComparison.Ordinal), s_limit);
        while (sort.Services.Snapshot.Session is null)
        {
            await Task.Delay(5);
        }

        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 3);
        await first;

        // The next reply is held back 30 s: the loop times out and reconnects. Meanwhile the part is
        // taken out and the next one put in, so the loop never reads the empty fixture.
        bench.Faults.ReplyDelay = TimeSpan.FromSeconds(30);
        bench.Faults.Inject(FaultKind.DelayReply);
        while (bench.Faults.Log.Count(FaultKind.DelayReply) == 0)
        {
            await Task.Delay(1);
        }

        bench.Fixture.Remove();
        bench.Fixture.Insert(bench.Reel[1], warmKelvin: 3);

        var outcome = await run;

        Assert.Equal(2, outcome.PartsRecorded);
        Assert.Contains("a new part went in while the meter was away", sort.Ears.Text, StringComparison.Ordinal);
        await using var log = await PrecisionLogFactory.OpenAsync(sort.Options.Database, null, default);
        var second = (await log.GetPartsAsync(outcome.SessionId, default))[1];
        Assert.InRange(second.Value, bench.Truth(1) - second.Measured.Expanded, bench.Truth(1) + second.Measured.Expanded);
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
        while (!sort.Services.Hub.History().Any(e => e.State == "Settling"))
        {
            await Task.Delay(1);
        }

        clock.Step(TimeSpan.FromSeconds(1));
        var outcome = await run;

        Assert.Equal(0, outcome.Unstable);
        Assert.Equal(1, outcome.Accepted);
        Assert.Contains("measuring the part again", sort.Ears.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task MeterResetBetweenSetupAndReadBack_RetriedAndSessionCarriesOn()
    {
        // Every message resets the meter at first, so each read-back after configuring differs;
        // after the operator has heard two of those the resets stop.
        var sort = new InProcessSort(Options(parts: 2, speed: 50));
        using var cts = new CancellationTokenSource(s_limit);
        var told = 0;
        var run = sort.RunAsync(b => b with { Faults = b.Faults with { SilentResetRate = 1 } }, cts.Token);
        var bench = await sort.Bench;
        sort.Ears.OnLine = line =>
        {
            if (line.Contains("setting read back wrong", StringComparison.Ordinal) && ++told == 2)
            {
                bench.Faults.SetRate(FaultKind.SilentReset, 0);
            }
        };

        var outcome = await run;

        Assert.Equal(2, outcome.PartsRecorded);
        Assert.True(told >= 2);
    }

    [Fact]
    public async Task MeterNeverHoldsTheSetup_SessionStopsAfterBoundedRetries()
    {
        var sort = new InProcessSort(Options(parts: 2, speed: 50));
        using var cts = new CancellationTokenSource(s_limit);

        await Assert.ThrowsAsync<InstrumentSetupException>(
            () => sort.RunAsync(b => b with { Faults = b.Faults with { SilentResetRate = 1 } }, cts.Token));

        var told = sort.Ears.Text.Split('\n').Count(l => l.Contains("setting read back wrong", StringComparison.Ordinal));
        Assert.Equal(MeterFaults.SetupRetries, told);
    }

    [Fact]
    public async Task FaultsPerThousandOption_InjectsFaultsIntoTheEmbeddedSimulator()
    {
        var options = Options(parts: 3, speed: 100);
        options.FaultsPerThousand = 100;
        var sort = new InProcessSort(options);
        using var cts = new CancellationTokenSource(s_limit);

        var outcome = await sort.RunAsync(null, cts.Token);

        var bench = await sort.Bench;
        Assert.Equal(3, outcome.PartsRecorded);
        Assert.True(bench.Faults.Log.Total > 0, "no fault injected");
        Assert.All(Enum.GetValues<FaultKind>(), k => Assert.Equal(0.1 / 5, bench.Faults.Rate(k), 12));
    }

    private SortOptions Options(int parts, double speed) => new()
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
