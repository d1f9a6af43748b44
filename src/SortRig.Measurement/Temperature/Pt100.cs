namespace SortRig.Measurement.Temperature;

/// <summary>Shorthand for the IEC 60751 Pt100 sensor (R0 = 100 ohm), as used by the bench thermometer
/// channel.</summary>
public static class Pt100
{
    /// <summary>Resistance of a Pt100 at <paramref name="celsius"/> (-200..850 degC), ohms.</summary>
    public static double Resistance(double celsius) => CallendarVanDusen.Pt100.Resistance(celsius);

    /// <summary>Temperature of a Pt100 reading <paramref name="ohms"/> (18.52..390.48 ohm), degC.</summary>
    public static double Temperature(double ohms) => CallendarVanDusen.Pt100.Temperature(ohms);
}
