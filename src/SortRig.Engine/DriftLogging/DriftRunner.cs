using Microsoft.Extensions.Logging;
using SortRig.Engine.Composition;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;
using SortRig.Simulator;
using SortRig.Storage;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// Assembles and runs a drift log: the embedded simulator (parts on the scanner, Pt100 on its channel) when
/// no resource is given, the meter profile, the precision log and the <see cref="DriftLogger"/>. The library parts put
/// on channels are checked against the log before the simulator starts or a run is stored.
/// </summary>
public static class DriftRunner
{
    /// <summary>Runs one drift log to its end (duration or cancellation) and returns the outcome with its
    /// analysis.</summary>
    /// <param name="settings">Validated settings.</param>
    /// <param name="services">Shared services.</param>
    /// <param name="onSimulatorStarted">Called with the embedded simulator once it serves (tests read its truth, inject
    /// faults).</param>
    /// <param name="ct">Stops the run; what was read by then is stored.</param>
    public static async Task<DriftOutcome> RunAsync(
        DriftSettings settings,
        DriftServices services,
        Action<SimulatedBench>? onSimulatorStarted,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(services);
        var profile = ProfileLocator.Load(settings.Profile);
        if (profile.Commands.ScannerClose is null && profile.Commands.ScannerScan is null)
        {
            throw new ArgumentException(
                $"Drift.Profile: profile '{profile.Family}' has no scanner_close or scanner_scan command; drift "
                    + $"logging needs a scanner.",
                nameof(settings)
            );
        }

        if (settings.Resource is { } given)
        {
            ResourceStringParser.Parse(given); // a bad resource fails here, before the log is opened
        }

        await using var log = await PrecisionLogFactory
            .OpenAsync(
                settings.Database,
                new PrecisionLogOptions { TimeProvider = services.Time, LoggerFactory = services.Loggers },
                ct
            )
            .ConfigureAwait(false);
        // before anything is logged
        await LibraryPartCheck.CheckAsync(log, settings.LibraryParts, ct).ConfigureAwait(false);

        SimulatedBench? bench = null;
        var resource = settings.Resource;
        try
        {
            if (resource is null)
            {
                bench = new SimulatedBench(DriftDemoBench.For(settings), services.Time, services.Loggers);
                DriftDemoBench.LoadParts(bench, settings);
                var endpoint = await bench.StartTcpAsync(0, ct).ConfigureAwait(false);
                resource = $"TCPIP::127.0.0.1::{endpoint.Port}::SOCKET";
                onSimulatorStarted?.Invoke(bench);
            }

            var connector = new MeterConnector(
                new MessageLinkFactory(services.LinkTime),
                services.Time,
                services.Loggers
            );
            var logger = new DriftLogger(
                settings,
                c => connector.ConnectAsync(resource, profile, checkIdentity: true, c),
                log,
                services.Hub,
                services.Time,
                services.Loggers.CreateLogger("SortRig.Engine.DriftLogging")
            );
            return await logger.RunAsync(ct).ConfigureAwait(false);
        }
        finally
        {
            if (bench is not null)
            {
                await bench.DisposeAsync().ConfigureAwait(false);
            }
        }
    }
}
