using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Building;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;
using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Simulator;
using SortRig.Storage;

namespace SortRig.Engine.Composition;

/// <summary>
/// Assembles and runs a sorting session: the embedded simulator when no resource is given, the
/// meter profile, the range plan, the precision log and the cup assigner.
/// </summary>
public static class SortRunner
{
    /// <summary>Runs one session to its end. The embedded simulator, if any, lives for the call.</summary>
    /// <param name="options">Session settings.</param>
    /// <param name="services">Shared services.</param>
    /// <param name="onSimulatorStarted">Called with the embedded simulator once it serves (tests read its
    /// truth).</param>
    /// <param name="ct">Stops the session.</param>
    public static Task<SortOutcome> RunAsync(
        SortOptions options,
        SortServices services,
        Action<SimulatedBench>? onSimulatorStarted,
        CancellationToken ct
    ) => RunWithHooksAsync(options, services, new SimulatorHooks { Started = onSimulatorStarted }, ct);

    /// <summary>Runs one session to its end with test hooks for the embedded simulator.</summary>
    internal static async Task<SortOutcome> RunWithHooksAsync(
        SortOptions options,
        SortServices services,
        SimulatorHooks hooks,
        CancellationToken ct
    )
    {
        var profile = ProfileLocator.Load(options.Profile);
        var plan = SortPlan.For(options, profile.Spec);
        SimulatedBench? bench = null;
        IFixtureHands hands = new HumanHands();
        var resource = options.Resource;
        try
        {
            if (string.IsNullOrWhiteSpace(resource))
            {
                var parts = options.Parts > 0 ? options.Parts : DemoBench.DefaultParts;
                options.Parts = parts;
                var benchOptions = DemoBench.For(options, parts);
                bench = new SimulatedBench(
                    hooks.Configure?.Invoke(benchOptions) ?? benchOptions,
                    services.Time,
                    services.Loggers,
                    hooks.OperatorTime
                );
                resource = hooks.Serve is { } serve
                    ? await serve(bench, ct).ConfigureAwait(false)
                    : $"TCPIP::127.0.0.1::{(await bench.StartTcpAsync(0, ct).ConfigureAwait(false)).Port}::SOCKET";
                hands = new SimulatorHands(bench);
                hooks.Started?.Invoke(bench);
            }

            ResourceStringParser.Parse(resource); // a bad resource fails here, before the log is opened
            var links = new MessageLinkFactory(services.LinkTime ?? services.Time);
            var connector = new MeterConnector(links, services.Time, services.Loggers);
            await using var log = await PrecisionLogFactory
                .OpenAsync(
                    options.Database,
                    new PrecisionLogOptions { TimeProvider = services.Time, LoggerFactory = services.Loggers },
                    ct
                )
                .ConfigureAwait(false);
            var target = await BuildTargets.LoadAsync(options, ct).ConfigureAwait(false);
            var cups = new BuildCupAssigner(
                CupAssignerFactory.Create(options),
                options.StockTolerance,
                new AssemblyOptions(),
                options.Assigner == AssignerKind.Slots
            );
            var context = new SortContext(
                plan,
                c => connector.ConnectAsync(resource, profile, checkIdentity: true, c),
                log,
                cups,
                new CompositeAnnouncer([new HubAnnouncer(services.Hub), services.Announcer]),
                services.Hub,
                services.Snapshot,
                services.Commands,
                hands,
                services.Time,
                services.Loggers.CreateLogger("SortRig.Engine.Sorting")
            )
            {
                Build = target,
            };
            return await new SortingLoop(context).RunAsync(ct).ConfigureAwait(false);
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
