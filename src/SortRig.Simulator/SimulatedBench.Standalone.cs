using Microsoft.Extensions.Logging;

namespace SortRig.Simulator;

/// <summary>The standalone entry that a command line calls.</summary>
public sealed partial class SimulatedBench
{
    /// <summary>
    /// Runs a bench until <paramref name="ct"/> is cancelled: serves TCP on <see cref="SimulatedBenchOptions.TcpPort"/>
    /// and/or serial on <see cref="SimulatedBenchOptions.SerialPath"/>, on the system clock scaled by
    /// <see cref="SimulatedBenchOptions.TimeScale"/>. The bound endpoint is logged.
    /// </summary>
    /// <param name="options">Bench options; at least one of TcpPort and SerialPath must be set.</param>
    /// <param name="ct">Stops the bench; the task then completes normally.</param>
    public static Task RunStandaloneAsync(SimulatedBenchOptions options, CancellationToken ct) =>
        RunStandaloneAsync(options, null, null, ct);

    /// <summary>As <see cref="RunStandaloneAsync(SimulatedBenchOptions, CancellationToken)"/>, with logging and a
    /// started callback.</summary>
    /// <param name="options">Bench options; at least one of TcpPort and SerialPath must be set.</param>
    /// <param name="loggerFactory">Logging; default none.</param>
    /// <param name="started">Called once serving, with the running bench (e.g. to print <see
    /// cref="TcpEndpoint"/>).</param>
    /// <param name="ct">Stops the bench; the task then completes normally.</param>
    public static async Task RunStandaloneAsync(
        SimulatedBenchOptions options,
        ILoggerFactory? loggerFactory,
        Action<SimulatedBench>? started,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(options);
        options.Validate();
        if (options.TcpPort is null && options.SerialPath is null)
        {
            throw new ArgumentException(
                "Set SimulatedBenchOptions.TcpPort or SimulatedBenchOptions.SerialPath (or both) to run standalone.",
                nameof(options)
            );
        }

        var clock = options.TimeScale == 1 ? TimeProvider.System : new ScaledTimeProvider(options.TimeScale);
        var bench = new SimulatedBench(options, clock, loggerFactory);
        await using (bench.ConfigureAwait(false))
        {
            if (options.TcpPort is int port)
            {
                await bench.StartTcpAsync(port, ct).ConfigureAwait(false);
            }

            if (options.SerialPath is string path)
            {
                await bench.StartSerialAsync(path, ct).ConfigureAwait(false);
            }

            started?.Invoke(bench);
            try
            {
                await Task.Delay(Timeout.InfiniteTimeSpan, ct).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (ct.IsCancellationRequested)
            {
                // Normal shutdown.
            }
        }
    }
}
