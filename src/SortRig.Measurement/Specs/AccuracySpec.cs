namespace SortRig.Measurement.Specs;

/// <summary>
/// A meter accuracy specification of the usual form ±(% of reading + % of range).
/// </summary>
/// <param name="PercentOfReading">Gain term, in percent of the reading. Must be &gt;= 0.</param>
/// <param name="PercentOfRange">Offset term, in percent of the range full scale. Must be &gt;= 0.</param>
public readonly record struct AccuracySpec(double PercentOfReading, double PercentOfRange)
{
    /// <summary>The half-width of the spec interval, in ohms, for a reading on a range.</summary>
    public double HalfWidth(double reading, double rangeFullScale) =>
        (PercentOfReading / 100.0 * Math.Abs(reading)) + (PercentOfRange / 100.0 * rangeFullScale);
}
