namespace SortRig.Measurement.Specs;

/// <summary>One resistance range of a meter.</summary>
/// <param name="FullScale">Nominal full scale in ohms (e.g. 10 000 for the 10 kOhm range).</param>
/// <param name="OverRangeFactor">Largest readable value as a multiple of full scale (e.g. 1.2). Must be &gt;=
/// 1.</param>
/// <param name="Accuracy24Hours">Accuracy within 24 h of calibration, 23 degC ± 1 K.</param>
/// <param name="Accuracy1Year">Accuracy within one year of calibration.</param>
/// <param name="TestCurrent">Source current in amperes, for self-heating estimates; 0 when unknown.</param>
public sealed record RangeSpec(
    double FullScale,
    double OverRangeFactor,
    AccuracySpec Accuracy24Hours,
    AccuracySpec Accuracy1Year,
    double TestCurrent
)
{
    /// <summary>The largest value the range reads before it overloads, in ohms.</summary>
    public double Limit => FullScale * OverRangeFactor;
}
