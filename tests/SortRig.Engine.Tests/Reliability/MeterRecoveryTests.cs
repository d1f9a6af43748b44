using SortRig.Engine.Sorting;
using SortRig.Engine.Tests.Reliability.Support;
using SortRig.Instruments.Drivers;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Storage;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Reliability;

/// <summary>Meter recoveries of the sorting loop, each provoked on purpose on the real simulator.</summary>
[Collection(ReliabilityCollection.Name)]
[Trait(ReliabilityCollection.Clock, ReliabilityCollection.Wall)]
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

        await Assert.ThrowsAsync<InstrumentSetupException>(() =>
            sort.RunAsync(b => b with { Faults = b.Faults with { SilentResetRate = 1 } }, cts.Token)
        );

        var told = sort
            .Ears.Text.Split('\n')
            .Count(l => l.Contains("setting read back wrong", StringComparison.Ordinal));
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
        // 100 per 1000 over six kinds
        Assert.All(Enum.GetValues<FaultKind>(), k => Assert.Equal(0.1 / 6, bench.Faults.Rate(k), 12));
    }

    [Fact]
    public async Task MeterAnswersOnlyNotANumber_BacksOffAndStopsNamingTheReply()
    {
        // Every reading reply is 9.91E+37, the SCPI not-a-number value (SCPI-99 vol. 1 sec. 7.2.1.5), while
        // connecting and configuring work: the session must stop after the documented count, not reconnect forever.
        var sort = new InProcessSort(Options(parts: 2, speed: 200));
        using var cts = new CancellationTokenSource(s_limit);

        var e = await Assert.ThrowsAsync<MeterUnreadableException>(() =>
            sort.RunAsync(b => b with { Faults = b.Faults with { NotANumberRate = 1 } }, cts.Token)
        );

        var bench = await sort.Bench;
        Assert.Equal(UnreadableStreak.DefaultLimit, e.Count);
        Assert.Equal(9.91e37, double.Parse(e.LastReply, System.Globalization.CultureInfo.InvariantCulture));
        Assert.Contains($"'{e.LastReply}' instead of a reading", e.Message, StringComparison.Ordinal);
        Assert.Equal(UnreadableStreak.DefaultLimit, bench.Faults.Log.Count(FaultKind.NotANumber));
        var told = sort.Ears.Text.Split('\n').Count(l => l.Contains("meter: not a number", StringComparison.Ordinal));
        Assert.Equal(UnreadableStreak.DefaultLimit - 1, told);

        // The waits between requests grow (0.25 s doubling to 5 s): 11 waits, 37.75 s of bench time at least.
        Assert.Contains("reading again in 5 s (11 of 12 in a row)", sort.Ears.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task AFewNotANumberReplies_SessionCarriesOnAndTheCountStartsAgain()
    {
        var sort = new InProcessSort(Options(parts: 3, speed: 100));
        using var cts = new CancellationTokenSource(s_limit);
        var run = sort.RunAsync(null, cts.Token);
        var bench = await sort.Bench;
        for (var i = 0; i < UnreadableStreak.DefaultLimit - 1; i++)
        {
            bench.Faults.Inject(FaultKind.NotANumber); // one short of the limit, all in a row
        }

        var outcome = await run;

        Assert.Equal(3, outcome.PartsRecorded);
        Assert.Equal(UnreadableStreak.DefaultLimit - 1, bench.Faults.Log.Count(FaultKind.NotANumber));
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
