namespace SortRig.Measurement.Readings;

/// <summary>What a single meter reading says about the input.</summary>
public enum ReadingKind
{
    /// <summary>A finite value within the range.</summary>
    Finite = 0,

    /// <summary>Over range or open circuit (SCPI-99 overflow value 9.9E37).</summary>
    Overload = 1,
}

/// <summary>
/// One reading from a meter: the value in the unit of the function (ohms for resistance,
/// degrees Celsius for temperature), the time it was taken and the range it was taken on.
/// </summary>
/// <param name="Value">Value in ohms (or degC); <see cref="double.PositiveInfinity"/> when <see cref="Kind"/> is
/// Overload.</param>
/// <param name="Time">When the reading completed, from the injected TimeProvider.</param>
/// <param name="Range">Full scale of the range used, in ohms; 0 when unknown.</param>
/// <param name="Kind">Finite or overload.</param>
public readonly record struct Reading(double Value, DateTimeOffset Time, double Range, ReadingKind Kind)
{
    /// <summary>The SCPI-99 overflow value that meters return for over range (IEEE 488.2 / SCPI-99 vol. 1 sec.
    /// 7.2.1.5).</summary>
    public const double ScpiOverflow = 9.9e37;

    /// <summary>True when the reading is a finite in-range value.</summary>
    public bool IsFinite => Kind == ReadingKind.Finite;

    /// <summary>Creates a finite reading.</summary>
    public static Reading Finite(double value, DateTimeOffset time, double range) =>
        new(value, time, range, ReadingKind.Finite);

    /// <summary>Creates an overload (open circuit / over range) reading.</summary>
    public static Reading Overload(DateTimeOffset time, double range) =>
        new(double.PositiveInfinity, time, range, ReadingKind.Overload);
}
