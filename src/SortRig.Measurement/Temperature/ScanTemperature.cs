using SortRig.Measurement.Readings;

namespace SortRig.Measurement.Temperature;

/// <summary>
/// The temperature step of a drift scan: the Pt100 channel is read before and after the parts, each reading is
/// turned into degC (IEC 60751, Callendar-Van Dusen) and each part reading gets the temperature interpolated
/// linearly in time between the two. Pure.
/// </summary>
public static class ScanTemperature
{
    /// <summary>
    /// The temperature of a Pt100 reading, degC; null for an overload or a value outside the sensor's
    /// -200..850 degC (18.52..390.48 ohm).
    /// </summary>
    public static double? Celsius(Reading reading)
    {
        if (reading.Kind != ReadingKind.Finite)
        {
            return null;
        }

        try
        {
            return Pt100.Temperature(reading.Value);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }

    /// <summary>
    /// The temperature at <paramref name="time"/>, degC: linear in time between the Pt100 readings before and after
    /// the parts; the one that is known when the other is missing (null when both are); their mean when both were
    /// taken at the same instant.
    /// </summary>
    /// <param name="before">The thermometer reading before the parts and its temperature (null degC when
    /// unusable).</param>
    /// <param name="after">The thermometer reading after the parts and its temperature.</param>
    /// <param name="time">When the part was read.</param>
    public static double? Interpolate(
        (Reading Reading, double? Celsius)? before,
        (Reading Reading, double? Celsius)? after,
        DateTimeOffset time
    )
    {
        if (before?.Celsius is not { } t1)
        {
            return after?.Celsius;
        }

        if (after?.Celsius is not { } t2)
        {
            return t1;
        }

        var span = (after.Value.Reading.Time - before.Value.Reading.Time).TotalSeconds;
        return span <= 0 ? (t1 + t2) / 2 : t1 + ((t2 - t1) * (time - before.Value.Reading.Time).TotalSeconds / span);
    }
}
