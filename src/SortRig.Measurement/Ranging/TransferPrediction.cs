using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>Predicts the transfer budget at a value before any reading is taken.</summary>
internal static class TransferPrediction
{
    public static Budget At(double value, RangeSpec range, NplcSpec nplc, bool fourWire, RangeRuleOptions options)
    {
        var n = options.ReadingsAveraged;
        var components = new List<BudgetComponent>(4)
        {
            new(ResistanceTerms.ResolutionName, ResistanceTerms.Resolution(range, nplc)),
            new(
                ResistanceTerms.NoiseName,
                ResistanceTerms.NoiseOfMean(range, nplc, n),
                1.0,
                n > 1 ? n - 1 : double.PositiveInfinity,
                UncertaintyKind.TypeA
            ),
            new(ResistanceTerms.ShortTermName, ResistanceTerms.ShortTerm(range, value, options.Model)),
        };
        if (!fourWire)
        {
            components.Add(
                new BudgetComponent(ResistanceTerms.LeadName, ResistanceTerms.Lead(fourWire, options.Model))
            );
        }

        return new Budget(components);
    }

    public static double Uncertainty(
        double value,
        RangeSpec range,
        NplcSpec nplc,
        bool fourWire,
        RangeRuleOptions options
    ) => At(value, range, nplc, fourWire, options).CombinedStandardUncertainty;

    /// <summary>The largest allowed expanded transfer uncertainty, ohms.</summary>
    public static double Allowed(RangeRequest request, RangeRuleOptions options) =>
        options.UncertaintyRatio * request.MatchTolerance * request.Nominal;
}
