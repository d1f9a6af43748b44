using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>Finds single-change remedies for a refused request.</summary>
internal static class RemedyFinder
{
    public static IReadOnlyList<Remedy> Find(
        MeterSpec meter,
        RangeRequest request,
        RangeSpec range,
        NplcSpec nplc,
        Budget budget,
        RangeRuleOptions options
    )
    {
        var k = options.CoverageFactor;
        var allowed = TransferPrediction.Allowed(request, options);
        var current = budget.CombinedStandardUncertainty;
        var nominal = request.Nominal;
        var remedies = new List<Remedy>();

        Remedy Make(RemedyKind kind, double setting, double u) => new(kind, setting, u, k * u, k * u <= allowed);

        if (!request.FourWire && meter.FourWire)
        {
            var leadDominates =
                budget.Components.Max(c => c.Contribution) == ResistanceTerms.Lead(false, options.Model);
            var fourWire = Make(
                RemedyKind.UseFourWire,
                4,
                TransferPrediction.Uncertainty(nominal, range, nplc, true, options)
            );
            if (leadDominates || fourWire.Resolves)
            {
                remedies.Add(fourWire);
            }
        }

        Remedy? bestNplc = null;
        foreach (var candidate in meter.Nplcs.Where(p => p.Nplc > nplc.Nplc).OrderBy(p => p.Nplc))
        {
            var remedy = Make(
                RemedyKind.RaiseNplc,
                candidate.Nplc,
                TransferPrediction.Uncertainty(nominal, range, candidate, request.FourWire, options)
            );
            if (remedy.Resolves)
            {
                bestNplc = remedy;
                break;
            }

            if (remedy.TransferUncertainty < (bestNplc?.TransferUncertainty ?? current))
            {
                bestNplc = remedy;
            }
        }

        if (bestNplc is not null)
        {
            remedies.Add(bestNplc);
        }

        var lower = meter
            .Ranges.Where(r => r.FullScale < range.FullScale)
            .OrderByDescending(r => r.FullScale)
            .FirstOrDefault();
        if (lower is not null && nominal * (1 + request.Margin) <= lower.Limit)
        {
            var remedy = Make(
                RemedyKind.UseRange,
                lower.FullScale,
                TransferPrediction.Uncertainty(nominal, lower, nplc, request.FourWire, options)
            );
            if (remedy.TransferUncertainty < current)
            {
                remedies.Add(remedy);
            }
        }

        remedies.Add(
            new Remedy(
                RemedyKind.LoosenMatch,
                LoosestNeeded(k * current, options.UncertaintyRatio * nominal),
                current,
                k * current,
                true
            )
        );
        return remedies;
    }

    /// <summary>The smallest match tolerance that the expanded uncertainty resolves, rounded up to 2 significant
    /// digits.</summary>
    private static double LoosestNeeded(double expanded, double ratioTimesNominal)
    {
        var exact = expanded / ratioTimesNominal;
        var scale = Math.Pow(10, Math.Floor(Math.Log10(exact)) - 1);
        return Math.Max(exact, Math.Ceiling(exact / scale * (1 - 1e-12)) * scale);
    }
}
