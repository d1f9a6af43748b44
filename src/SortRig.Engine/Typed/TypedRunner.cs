using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Composition;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Resources;
using SortRig.Measurement.Settling;
using SortRig.Storage;

namespace SortRig.Engine.Typed;

/// <summary>
/// Runs a sorting session on a meter with no computer link (resource TYPED::profile): the profile from
/// instruments/typed/, the precision log and the cup assigner as for any sort, and the operator's typed lines.
/// </summary>
public static class TypedRunner
{
    /// <summary>Runs one session to its end (or to the end of input, or cancellation).</summary>
    /// <param name="options">Session settings; <see cref="SortOptions.Resource"/> is a TYPED resource.</param>
    /// <param name="services">Shared services.</param>
    /// <param name="entries">The operator's typed lines.</param>
    /// <param name="settle">Settle rule for people; default <see cref="HandSettleOptions.Default"/>.</param>
    /// <param name="ct">Stops the session; it stays resumable.</param>
    /// <exception cref="ResourceStringException">The resource is not a TYPED resource.</exception>
    public static async Task<SortOutcome> RunAsync(
        SortOptions options,
        SortServices services,
        TypedEntries entries,
        HandSettleOptions? settle,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentNullException.ThrowIfNull(services);
        var resource =
            ResourceStringParser.Parse(options.Resource) as TypedResource
            ?? throw new ArgumentException($"'{options.Resource}' is not a TYPED::profile resource", nameof(options));
        var meter = TypedProfileLocator.Load(resource.Profile);
        await using var log = await PrecisionLogFactory
            .OpenAsync(
                options.Database,
                new PrecisionLogOptions { TimeProvider = services.Time, LoggerFactory = services.Loggers },
                ct
            )
            .ConfigureAwait(false);
        var context = new TypedContext(
            options,
            meter,
            settle ?? HandSettleOptions.Default,
            entries,
            log,
            CupAssignerFactory.Create(options),
            new CompositeAnnouncer([new HubAnnouncer(services.Hub), services.Announcer]),
            services.Hub,
            services.Snapshot,
            services.Time,
            services.Loggers.CreateLogger("SortRig.Engine.Typed")
        );
        return await new TypedSortingLoop(context).RunAsync(ct).ConfigureAwait(false);
    }
}
