using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Ranging;

/// <summary>
/// Chooses the meter range for a nominal and says whether the match band can be resolved there.
/// Pure: no I/O. See docs/measurement.md, "Range rule".
/// </summary>
public static class RangeRule
{
    /// <summary>The decision for one nominal.</summary>
    /// <param name="meter">The meter's metrology; ranges need not be sorted.</param>
    /// <param name="request">The nominal and its demands.</param>
    /// <param name="options">Rule options; <see cref="RangeRuleOptions.Default"/> when null.</param>
    /// <exception cref="ArgumentException">The NPLC is not a setting of the meter, 4-wire is asked of a 2-wire
    /// meter, or no range holds the required limit.</exception>
    public static RangeDecision Choose(MeterSpec meter, RangeRequest request, RangeRuleOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(meter);
        ArgumentNullException.ThrowIfNull(request);
        options ??= RangeRuleOptions.Default;
        var nplc = NplcOf(meter, request.Nplc);
        if (request.FourWire && !meter.FourWire)
        {
            throw new ArgumentException(
                $"Meter family '{meter.Family}' cannot measure 4-wire resistance; request 2-wire.",
                nameof(request)
            );
        }

        var range = meter.Ranges.Where(r => r.Limit >= request.RequiredLimit).MinBy(r => r.FullScale)
            ?? throw new ArgumentException(
                $"Nominal {request.Nominal:G6} ohm needs a range reading up to {request.RequiredLimit:G6} ohm "
                    + $"(nominal × (1 + stock tolerance) × (1 + margin)); the largest limit of meter family '"
                    + $"{meter.Family}' is "
                    + $"{(meter.Ranges.Count == 0 ? 0 : meter.Ranges.Max(r => r.Limit)):G6} ohm.",
                nameof(request)
            );
        return On(meter, request, range, nplc, options);
    }

    /// <summary>
    /// Decisions for every nominal of a job and, where nominals sit on different ranges, one
    /// <see cref="RangeTransfer"/> offer per pair of neighbouring ranges used.
    /// </summary>
    public static RangePlan Plan(
        MeterSpec meter,
        IReadOnlyList<RangeRequest> requests,
        RangeRuleOptions? options = null
    )
    {
        ArgumentNullException.ThrowIfNull(requests);
        if (requests.Count == 0)
        {
            throw new ArgumentException("A plan needs at least one range request.", nameof(requests));
        }

        options ??= RangeRuleOptions.Default;
        var decisions = requests.Select(r => Choose(meter, r, options)).ToArray();
        var transfers = new List<RangeTransfer>();
        var used = decisions.Select(d => d.Range).Distinct().OrderBy(r => r.FullScale).ToArray();
        for (var i = 0; i + 1 < used.Length; i++)
        {
            transfers.Add(RangeTransfer.Offer(used[i], used[i + 1], decisions, options));
        }

        return new RangePlan(decisions, transfers);
    }

    /// <summary>The decision for a request on a given range (used for remedies and transfers).</summary>
    internal static RangeDecision On(
        MeterSpec meter,
        RangeRequest request,
        RangeSpec range,
        NplcSpec nplc,
        RangeRuleOptions options
    )
    {
        var nominal = request.Nominal;
        var budget = TransferPrediction.At(nominal, range, nplc, request.FourWire, options);
        var u = budget.CombinedStandardUncertainty;
        var expanded = options.CoverageFactor * u;
        var allowed = TransferPrediction.Allowed(request, options);
        var verdict = expanded <= allowed ? RangeVerdict.Resolvable : RangeVerdict.Refused;
        var remedies =
            verdict == RangeVerdict.Resolvable
                ? Array.Empty<Remedy>()
                : RemedyFinder.Find(meter, request, range, nplc, budget, options);
        var step = nplc.Resolution(range.FullScale);
        return new RangeDecision(
            request,
            range,
            nplc,
            step,
            step / nominal * 1e6,
            range.Accuracy24Hours.HalfWidth(nominal, range.FullScale),
            range.Accuracy1Year.HalfWidth(nominal, range.FullScale),
            budget,
            u,
            expanded,
            allowed,
            verdict,
            remedies
        );
    }

    internal static NplcSpec NplcOf(MeterSpec meter, double nplc) =>
        meter.Nplcs.FirstOrDefault(p => Math.Abs(p.Nplc - nplc) <= 1e-9 * Math.Max(1.0, nplc))
        ?? throw new ArgumentException(
            $"NPLC {nplc:G6} is not a setting of meter family '{meter.Family}'; expected one of "
                + string.Join(
                    ", ",
                    meter.Nplcs.Select(p => p.Nplc.ToString("G6", System.Globalization.CultureInfo.InvariantCulture))
                )
                + ".",
            nameof(nplc)
        );
}
