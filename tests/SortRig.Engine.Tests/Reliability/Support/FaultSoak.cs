using System.Diagnostics;
using System.Globalization;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Simulator;
using SortRig.Simulator.Faults;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Reliability.Support;

/// <summary>What one soak produced: the session as stored, what the operator heard, the faults the simulator
/// injected.</summary>
internal sealed record SoakResult(
    SortOptions Options,
    SortOutcome Outcome,
    IReadOnlyList<PartRecord> Parts,
    IReadOnlyDictionary<long, int> ReadingCounts,
    IReadOnlyDictionary<int, double> Truth,
    IReadOnlyDictionary<FaultKind, int> Injected,
    int DwellTimeouts,
    string Heard,
    IntegrityReport Integrity,
    TimeSpan Wall
);

/// <summary>
/// Runs the real sorting loop against the embedded simulator with random faults at a given rate
/// per exchange, on a real SQLite file, and collects everything the checks need.
/// </summary>
internal static class FaultSoak
{
    // Share of the fault rate per kind: every kind well represented (our choice).
    private static readonly (FaultKind Kind, double Share)[] s_mix =
    [
        (FaultKind.DropConnection, 0.2),
        (FaultKind.DelayReply, 0.15),
        (FaultKind.GarbleReply, 0.25),
        (FaultKind.SpuriousError, 0.2),
        (FaultKind.SilentReset, 0.2),
    ];

    /// <summary>
    /// The kinds the soak injects. NotANumber is left out: a run of them stops a session by design (the meter that
    /// only answers NaN); MeterRecoveryTests covers it on its own.
    /// </summary>
    public static IEnumerable<FaultKind> Kinds => s_mix.Select(m => m.Kind);

    public static SortOptions Options(string dir, SoakSettings s) =>
        new()
        {
            Database = Path.Combine(dir, "soak.db"),
            Session = "soak",
            Parts = s.Parts,
            Seed = s.Seed,
            Speed = s.Speed,
            Nplc = 10, // not the meter's default, so a reset to defaults is visible in the read-back
            Speech = false,
            Live = false,
        };

    public static async Task<SoakResult> RunAsync(
        SortOptions options,
        SoakSettings s,
        Func<SimulatedBench, CancellationToken, Task<string>>? serve,
        TimeSpan limit
    )
    {
        var time = new ScaledTimeProvider(options.Speed);
        var heard = new StringWriter { NewLine = "\n" };
        var services = new SortServices(
            time,
            new BenchEventHub(time),
            new BenchSnapshot(),
            new OperatorCommands(),
            new PlainTextAnnouncer(TextWriter.Synchronized(heard)),
            NullLoggerFactory.Instance
        );
        SimulatedBench? bench = null;
        var hooks = new SimulatorHooks
        {
            Configure = b =>
                b with
                {
                    SerialBaudRate = 115_200,
                    Faults = new FaultOptions
                    {
                        DropRate = Rate(FaultKind.DropConnection, s.FaultRate),
                        DelayRate = Rate(FaultKind.DelayReply, s.FaultRate),
                        GarbleRate = Rate(FaultKind.GarbleReply, s.FaultRate),
                        SpuriousErrorRate = Rate(FaultKind.SpuriousError, s.FaultRate),
                        SilentResetRate = Rate(FaultKind.SilentReset, s.FaultRate),
                        // past the 6.2 s read timeout of the simulator profile at 10 NPLC
                        ReplyDelay = TimeSpan.FromSeconds(8),
                    },

                    // The operator was told to leave the part in while the meter reconnects: a patient
                    // person; and a quick one, with parts barely warmed (the soak is about faults, not heat).
                    Operator = b.Operator with
                    {
                        MaxDwell = TimeSpan.FromHours(1),
                        HandlingTimeMin = TimeSpan.FromSeconds(0.3),
                        HandlingTimeMax = TimeSpan.FromSeconds(0.8),
                        ReactionTimeMin = TimeSpan.FromSeconds(0.2),
                        ReactionTimeMax = TimeSpan.FromSeconds(0.5),
                        WarmKelvinMin = 0.5,
                        WarmKelvinMax = 1.5,
                    },
                },
            Started = b => bench = b,
            Serve = serve,
        };
        using var timeout = new CancellationTokenSource(limit);
        var wall = Stopwatch.StartNew();
        SortOutcome outcome;
        try
        {
            outcome = await SortRunner.RunWithHooksAsync(options, services, hooks, timeout.Token);
        }
        catch (OperationCanceledException) when (timeout.IsCancellationRequested)
        {
            throw new TimeoutException(
                $"soak did not finish in {limit}; {services.Snapshot.Parts().Count} parts so far; heard:\n"
                    + $"{Tail(heard.ToString())}"
            );
        }

        wall.Stop();
        var truth = Enumerable.Range(1, options.Parts).ToDictionary(n => n, n => bench!.Truth(n - 1));
        await using var log = await PrecisionLogFactory.OpenAsync(options.Database, null, default);
        var parts = await log.GetPartsAsync(outcome.SessionId, default);
        var counts = new Dictionary<long, int>();
        foreach (var p in parts)
        {
            counts[p.Id] = (await log.GetReadingsAsync(p.Id, default)).Count;
        }

        var integrity = await log.VerifyAsync(default);
        return new SoakResult(
            options,
            outcome,
            parts,
            counts,
            truth,
            bench!.Faults.Log.Snapshot(),
            bench.Operator.DwellTimeouts,
            heard.ToString(),
            integrity,
            wall.Elapsed
        );
    }

    /// <summary>One row of the figures table (markdown).</summary>
    public static string Figures(string transport, SoakResult r, int linkCuts)
    {
        var (lost, doubled, wrong) = SoakChecks.Tally(r);
        var told = Announcements.Notes(r.Heard).Count(n => n.StartsWith("meter", StringComparison.Ordinal));
        return string.Create(
            CultureInfo.InvariantCulture,
            $"| {transport} | {r.Options.Parts} | {r.Injected.Values.Sum()} | "
                + $"{string.Join(" / ", s_mix.Select(m => r.Injected[m.Kind]))} | {linkCuts} | {told} | {lost} | "
                + $"{doubled} | {wrong} | {r.Wall.TotalSeconds:0} s |"
        );
    }

    private static double Rate(FaultKind kind, double total) => total * s_mix.Single(m => m.Kind == kind).Share;

    private static string Tail(string text) => string.Join('\n', text.Split('\n').TakeLast(40));
}
