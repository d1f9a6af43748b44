using SortRig.Engine.Sorting;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Instruments.Drivers;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Storage;

namespace SortRig.Host.Tests.Reliability;

/// <summary>Meter recoveries of the sorting loop, each provoked on purpose on the real simulator.</summary>
[Collection(ReliabilityCollection.Name)]
public sealed class MeterRecoveryTests : IDisposable
{
    private static readonly TimeSpan s_limit = TimeSpan.FromSeconds(60);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-recover-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

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
