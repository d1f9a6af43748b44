using SortRig.Engine.Composition;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Ordering;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Host.OrderVerb;

/// <summary>Where the order verb's value distribution and uncertainty come from.</summary>
internal static class StockSource
{
    /// <summary>Default expanded transfer uncertainty when neither --uncertainty nor --meter is given: 20
    /// ppm.</summary>
    public const double DefaultUncertainty = 20e-6;

    public static async Task<(StockDistribution Stock, string Source)> LoadAsync(
        OrderRequest request,
        CancellationToken cancellationToken
    )
    {
        if (request.FromSession is null && !request.FromLibrary)
        {
            if (!(request.Tolerance is > 0 and <= 0.5))
            {
                throw new VerbException(
                    FormattableString.Invariant($"--tolerance: {request.Tolerance * 100:0.###} % is outside (0, 50 %]")
                );
            }

            return (
                request.Stock.Trim().ToLowerInvariant() switch
                {
                    "normal" => StockDistribution.Normal(request.Tolerance),
                    "uniform" => StockDistribution.Uniform(request.Tolerance),
                    "bimodal" => request.Gap is >= 0 and <= 0.9
                        ? StockDistribution.Bimodal(request.Tolerance, request.Gap)
                        : throw new VerbException(
                            FormattableString.Invariant($"--gap: {request.Gap} is outside 0 to 0.9 of the tolerance")
                        ),
                    _ => throw new VerbException($"--stock: '{request.Stock}' is not normal, uniform or bimodal"),
                },
                "assumed"
            );
        }

        if (request.FromSession is not null && request.FromLibrary)
        {
            throw new VerbException("--from-session and --from-library: give one of them");
        }

        var flag = request.FromSession is null ? "--from-library" : "--from-session";
        await using var log = await VerbGuard.OpenLogAsync(request.Database, cancellationToken).ConfigureAwait(false);
        IReadOnlyList<PartRecord> parts;
        string source;
        if (request.FromSession is { } name)
        {
            var session = await SessionLookup.FindAsync(log, name, cancellationToken).ConfigureAwait(false);
            parts = await log.GetPartsAsync(session.Id, cancellationToken).ConfigureAwait(false);
            source = $"session '{session.Name}' (id {session.Id})";
        }
        else
        {
            parts = await log.FindPartsAsync(
                    new LibraryQuery(Status: LibraryStatus.Available, Limit: PlanRunner.LibraryLimit),
                    cancellationToken
                )
                .ConfigureAwait(false);
            source = "the library's available parts";
        }

        var deviations = parts
            .Where(p => p.IsLive && p.Nominal > 0)
            .Select(p => (p.Value / p.Nominal) - 1)
            .Where(d => Math.Abs(d) <= 0.5)
            .ToList();
        if (deviations.Count < 2)
        {
            throw new VerbException(
                $"{flag}: {source} has {deviations.Count} measured part(s); a value distribution needs at least 2"
            );
        }

        return (StockDistribution.Empirical(deviations), $"{source}, {deviations.Count} parts");
    }

    /// <summary>
    /// The expanded (k = 2) transfer uncertainty, relative: --uncertainty as given, else the meter profile's transfer
    /// budget for one reading at each nominal on the smallest range that holds it (the largest over the nominals), else
    /// 20 ppm.
    /// </summary>
    public static (double Uncertainty, string Source) Uncertainty(OrderRequest request, Recipe recipe, double tolerance)
    {
        if (request.Uncertainty is { } u)
        {
            return u is >= 0 and <= 0.01
                ? (u, "given")
                : throw new VerbException(
                    FormattableString.Invariant($"--uncertainty: {u * 1e6:0.###} ppm is outside 0 to 10 000 ppm")
                );
        }

        if (request.Meter is not { } meter)
        {
            return (DefaultUncertainty, "default");
        }

        SortRig.Instruments.Profiles.MeterProfile profile;
        try
        {
            profile = ProfileLocator.Load(meter);
        }
        catch (SortRig.Instruments.Profiles.ProfileException e)
        {
            throw new VerbException($"--meter: {e.Message}");
        }

        var nplc = profile.FindNplc(request.Nplc)
            ?? throw new VerbException(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"--nplc: {request.Nplc} is not one of {profile.Family}'s settings ("
                        + $"{string.Join(", ", profile.Spec.Nplcs.Select(n => n.Nplc))})"
                )
            );
        var worst = 0.0;
        foreach (var nominal in recipe.SinglePartDemand.Keys)
        {
            var top = nominal * (1 + tolerance);
            var range = profile.Spec.Ranges.Where(r => r.Limit >= top).OrderBy(r => r.FullScale).FirstOrDefault()
                ?? throw new VerbException(
                    FormattableString.Invariant($"--meter: {profile.Family} has no range for {nominal:0.###} ohm")
                );
            var reading = Reading.Finite(nominal, DateTimeOffset.UnixEpoch, range.FullScale);
            var budget = ResistanceUncertainty.TransferBudget([reading], range, nplc, profile.Spec.FourWire);
            worst = Math.Max(worst, 2 * budget.CombinedStandardUncertainty / nominal);
        }

        return (worst, FormattableString.Invariant($"{profile.Family} at NPLC {request.Nplc}"));
    }
}
