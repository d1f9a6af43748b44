using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;
using SortRig.Simulator;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Tests.Support;

/// <summary>Runs a drift log on the embedded simulator (real TCP socket, real SQLite file) in virtual time.</summary>
internal static class DriftRuns
{
    public static readonly DateTimeOffset Start = new(2025, 11, 14, 18, 0, 0, TimeSpan.Zero);

    public static async Task<(DriftOutcome Outcome, SimulatedBench Bench)> RunAsync(
        DriftSettings settings,
        Action<SimulatedBench, DateTimeOffset>? beforeJump = null
    )
    {
        var clock = new VirtualClock(Start);
        var services = new DriftServices(
            clock,
            TimeProvider.System,
            new BenchEventHub(clock),
            NullLoggerFactory.Instance
        );
        SimulatedBench? bench = null;
        var run = DriftRunner.RunAsync(settings, services, b => bench = b, CancellationToken.None);
        using var limit = new CancellationTokenSource(TimeSpan.FromMinutes(2));
        await clock.DriveAsync(
            run,
            t =>
            {
                if (bench is not null)
                {
                    beforeJump?.Invoke(bench, t);
                }
            },
            limit.Token
        );
        return (await run, bench!);
    }

    public static async Task<List<StoredDriftSample>> SamplesAsync(string database, long runId)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(database, null, default);
        var samples = new List<StoredDriftSample>();
        await foreach (var s in log.ReadDriftSamplesAsync(runId, default))
        {
            samples.Add(s);
        }

        return samples;
    }

    public static async Task<IReadOnlyList<DriftGap>> GapsAsync(string database, long runId)
    {
        await using var log = await PrecisionLogFactory.OpenAsync(database, null, default);
        return await log.GetDriftGapsAsync(runId, default);
    }
}
