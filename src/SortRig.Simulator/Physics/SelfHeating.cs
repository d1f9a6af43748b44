namespace SortRig.Simulator.Physics;

/// <summary>
/// Self-heating by the meter's test current: P = I² R warms the part by P θ, reached with the body's time
/// constant. The current is our own invention: 1 V across the range's full scale, at most 10 mA (10 mA on
/// 100 Ohm, 1 mA on 1 kOhm, 100 µA on 10 kOhm), so it matters on low ranges only.
/// </summary>
internal static class SelfHeating
{
    /// <summary>The test current on a range, amperes.</summary>
    public static double TestCurrentAmps(double rangeOhms) => Math.Min(0.01, 1.0 / rangeOhms);

    /// <summary>The resistance the meter sees on a range, with the warming its current has caused so far.</summary>
    public static double Apply(InputSample input, double rangeOhms)
    {
        if (input.IsOpen || input.HeatingKelvinPerWatt == 0)
        {
            return input.Ohms;
        }

        var current = TestCurrentAmps(rangeOhms);
        var kelvin = current * current * input.Ohms * input.HeatingKelvinPerWatt;
        return input.Ohms * (1 + (input.TempcoPpmPerKelvin * 1e-6 * kelvin));
    }
}
