using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Simulator;

namespace SortRig.Tests.Support;

/// <summary>
/// Runs one sorting session in this process on the embedded simulator (real TCP socket, real SQLite file) on a
/// test-driven <see cref="VirtualClock"/>: the meter's apertures, the operator's handling and the session's waits
/// move virtual time, link timeouts run on the system clock. A loaded machine makes the run slower, never different
/// in kind: no wall-clock stall can look like minutes of bench time, so these sessions may run beside each other.
/// </summary>
internal sealed class VirtualSort
{
    /// <summary>Bench time at the start of every run (any instant will do; fixed so that logs read alike).</summary>
    public static readonly DateTimeOffset Start = new(2026, 1, 12, 8, 0, 0, TimeSpan.Zero);

    private SimulatedBench? _bench;

    public VirtualSort(IAnnouncer announcer, BenchSnapshot? snapshot = null)
    {
        Clock = new VirtualClock(Start);
        Services = new SortServices(
            Clock,
            new BenchEventHub(Clock),
            snapshot ?? new BenchSnapshot(),
            new OperatorCommands(),
            announcer,
            NullLoggerFactory.Instance
        )
        {
            LinkTime = TimeProvider.System,
        };
    }

    public VirtualClock Clock { get; }

    public SortServices Services { get; }

    /// <summary>The embedded bench of the last run (its truth stays readable after the run).</summary>
    public SimulatedBench Bench => _bench ?? throw new InvalidOperationException("the bench never started");

    /// <summary>
    /// Runs the session to its end (or until <paramref name="ct"/> stops it, as Ctrl+C would), driving the clock;
    /// fails after <paramref name="limit"/> of real time (default 3 minutes).
    /// </summary>
    public async Task<SortOutcome> RunAsync(
        SortOptions options,
        Func<SimulatedBenchOptions, SimulatedBenchOptions>? configure = null,
        TimeSpan? limit = null,
        CancellationToken ct = default
    )
    {
        using var timeout = new CancellationTokenSource(limit ?? TimeSpan.FromMinutes(3));
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(timeout.Token, ct);
        var hooks = new SimulatorHooks
        {
            Configure = configure,
            OperatorTime = Clock.OperatorView,
            Started = b => _bench = b,
        };
        var run = SortRunner.RunWithHooksAsync(options, Services, hooks, stop.Token);
        try
        {
            await Clock.DriveAsync(run, null, stop.Token);
            return await run;
        }
        catch (OperationCanceledException) when (timeout.IsCancellationRequested)
        {
            throw new TimeoutException($"the session did not end in {limit ?? TimeSpan.FromMinutes(3)} of real time");
        }
        catch (OperationCanceledException) when (stop.IsCancellationRequested && !run.IsCompleted)
        {
            await Task.WhenAny(run); // stopped on purpose: let the session close its log before the caller reads it
            throw;
        }
    }
}
