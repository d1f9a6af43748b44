using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Uncertainty;

/// <summary>The individual standard-uncertainty terms of a resistance reading, in ohms.</summary>
internal static class ResistanceTerms
{
    public const string TypeAName = "repeatability (Type A, mean of window)";
    public const string NoiseName = "reading noise of the mean (from spec)";
    public const string ResolutionName = "resolution (rectangular, half step)";
    public const string SpecName = "meter accuracy spec (rectangular)";
    public const string ShortTermName = "short-term stability (fraction of 24 h spec)";
    public const string LeadName = "2-wire lead and contact variation (rectangular)";

    /// <summary>Resolution: half the least significant step as a rectangular half-width (JCGM 100:2008
    /// F.2.2.1).</summary>
    public static double Resolution(RangeSpec range, NplcSpec nplc) =>
        TypeB.Rectangular(nplc.Resolution(range.FullScale) / 2.0);

    /// <summary>Predicted noise of the mean of n readings from the spec'd RMS noise.</summary>
    public static double NoiseOfMean(RangeSpec range, NplcSpec nplc, int n) =>
        nplc.NoisePpmOfRange * 1e-6 * range.FullScale / Math.Sqrt(n);

    /// <summary>Absolute accuracy: the spec half-width for the period, rectangular.</summary>
    public static double Spec(RangeSpec range, double value, SpecPeriod period) =>
        TypeB.Rectangular(range.AccuracyFor(period).HalfWidth(value, range.FullScale));

    /// <summary>Short-term stability: a fraction of the 24 h half-width, rectangular.</summary>
    public static double ShortTerm(RangeSpec range, double value, UncertaintyModel model) =>
        TypeB.Rectangular(model.ShortTermFractionOf24Hours * range.Accuracy24Hours.HalfWidth(value, range.FullScale));

    /// <summary>Lead and contact variation; zero for 4-wire.</summary>
    public static double Lead(bool fourWire, UncertaintyModel model) =>
        fourWire ? 0.0 : TypeB.Rectangular(model.LeadVariationOhms);
}
