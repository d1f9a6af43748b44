using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// Uncertainty of the mean of a window of resistance readings taken on one range at one NPLC
/// (JCGM 100:2008 sec. 4 and 5). See docs/measurement.md for the model.
/// </summary>
public static class ResistanceUncertainty
{
    /// <summary>
    /// The mean of the readings with its absolute and transfer standard uncertainties, k = 2.
    /// Absolute: Type A + spec (rectangular) + resolution (rectangular) [+ lead, 2-wire].
    /// Transfer: Type A + resolution + short-term stability [+ lead, 2-wire].
    /// </summary>
    /// <param name="readings">At least one reading, all finite.</param>
    /// <param name="range">The range the readings were taken on.</param>
    /// <param name="nplc">The integration time they were taken at.</param>
    /// <param name="period">Which accuracy spec applies (time since calibration).</param>
    /// <param name="fourWire">True for a 4-wire measurement (default); false adds the lead term.</param>
    /// <param name="model">Model assumptions; <see cref="UncertaintyModel.Default"/> when null.</param>
    public static MeasuredValue For(
        IReadOnlyList<Reading> readings,
        RangeSpec range,
        NplcSpec nplc,
        SpecPeriod period,
        bool fourWire = true,
        UncertaintyModel? model = null
    )
    {
        var absolute = AbsoluteBudget(readings, range, nplc, period, fourWire, model);
        var transfer = TransferBudget(readings, range, nplc, fourWire, model);
        return new MeasuredValue(
            Mean(Values(readings)),
            absolute.CombinedStandardUncertainty,
            transfer.CombinedStandardUncertainty
        );
    }

    /// <summary>
    /// The absolute budget, ohms. The spec line is the larger of the period's spec and the short-term term, so
    /// the transfer uncertainty never exceeds the absolute one.
    /// </summary>
    public static Budget AbsoluteBudget(
        IReadOnlyList<Reading> readings,
        RangeSpec range,
        NplcSpec nplc,
        SpecPeriod period,
        bool fourWire = true,
        UncertaintyModel? model = null
    )
    {
        model ??= UncertaintyModel.Default;
        var values = Values(readings);
        var mean = Mean(values);
        var spec = Math.Max(ResistanceTerms.Spec(range, mean, period), ResistanceTerms.ShortTerm(range, mean, model));
        return Build(values, range, nplc, fourWire, model, new BudgetComponent(ResistanceTerms.SpecName, spec));
    }

    /// <summary>The transfer budget, ohms: what matters when comparing parts on one range within a session.</summary>
    public static Budget TransferBudget(
        IReadOnlyList<Reading> readings,
        RangeSpec range,
        NplcSpec nplc,
        bool fourWire = true,
        UncertaintyModel? model = null
    )
    {
        model ??= UncertaintyModel.Default;
        var values = Values(readings);
        var shortTerm = ResistanceTerms.ShortTerm(range, Mean(values), model);
        return Build(
            values,
            range,
            nplc,
            fourWire,
            model,
            new BudgetComponent(ResistanceTerms.ShortTermName, shortTerm)
        );
    }

    private static Budget Build(
        double[] values,
        RangeSpec range,
        NplcSpec nplc,
        bool fourWire,
        UncertaintyModel model,
        BudgetComponent stability
    )
    {
        ArgumentNullException.ThrowIfNull(range);
        ArgumentNullException.ThrowIfNull(nplc);
        var repeatability =
            values.Length >= 2
                ? TypeA.Component(ResistanceTerms.TypeAName, values)
                : new BudgetComponent(ResistanceTerms.NoiseName, ResistanceTerms.NoiseOfMean(range, nplc, 1));
        var components = new List<BudgetComponent>(4)
        {
            repeatability,
            new(ResistanceTerms.ResolutionName, ResistanceTerms.Resolution(range, nplc)),
            stability,
        };
        if (!fourWire)
        {
            components.Add(new BudgetComponent(ResistanceTerms.LeadName, ResistanceTerms.Lead(fourWire, model)));
        }

        return new Budget(components);
    }

    private static double[] Values(IReadOnlyList<Reading> readings)
    {
        ArgumentNullException.ThrowIfNull(readings);
        if (readings.Count == 0)
        {
            throw new ArgumentException("At least one reading is needed for a measured value.", nameof(readings));
        }

        var values = new double[readings.Count];
        for (var i = 0; i < values.Length; i++)
        {
            var r = readings[i];
            values[i] =
                r.IsFinite && double.IsFinite(r.Value)
                    ? r.Value
                    : throw new ArgumentException(
                        $"Reading {i} at {r.Time:O} is an overload; only finite readings make a measured value.",
                        nameof(readings)
                    );
        }

        return values;
    }

    private static double Mean(double[] values) => MathNet.Numerics.Statistics.ArrayStatistics.Mean(values);
}
