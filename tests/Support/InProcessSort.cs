using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Simulator;

namespace SortRig.Tests.Support;

/// <summary>Starts a sorting session in this process on the embedded simulator, with test hooks.</summary>
internal sealed class InProcessSort
{
    private readonly TaskCompletionSource<SimulatedBench> _bench = new(
        TaskCreationOptions.RunContinuationsAsynchronously
    );

    public InProcessSort(SortOptions options, TimeProvider? inner = null)
    {
        Options = options;
        Time = new ScaledTimeProvider(options.Speed, inner);
        Services = new SortServices(
            Time,
            new BenchEventHub(Time),
            new BenchSnapshot(),
            new OperatorCommands(),
            Ears,
            NullLoggerFactory.Instance
        );
    }

    public SortOptions Options { get; }

    public ScaledTimeProvider Time { get; }

    public ListeningAnnouncer Ears { get; } = new();

    public SortServices Services { get; }

    /// <summary>The embedded bench once it serves.</summary>
    public Task<SimulatedBench> Bench => _bench.Task;

    /// <summary>Runs the session; <paramref name="configure"/> adjusts the bench options (faults, operator).</summary>
    public Task<SortOutcome> RunAsync(
        Func<SimulatedBenchOptions, SimulatedBenchOptions>? configure,
        CancellationToken ct
    )
    {
        var run = SortRunner.RunWithHooksAsync(
            Options,
            Services,
            new SimulatorHooks { Configure = configure, Started = b => _bench.TrySetResult(b) },
            ct
        );

        // A run that fails before the bench serves must not leave a test waiting for the bench.
        _ = run.ContinueWith(
            t => _bench.TrySetException(t.Exception?.InnerExceptions ?? [new OperationCanceledException()]),
            CancellationToken.None,
            TaskContinuationOptions.NotOnRanToCompletion,
            TaskScheduler.Default
        );
        return run;
    }

    /// <summary>Polls until <paramref name="condition"/> holds; fails the test after <paramref
    /// name="limit"/>.</summary>
    public static Task UntilAsync(Func<bool> condition, TimeSpan limit, string what) =>
        Eventually.HoldsAsync(condition, limit, what);
}
