namespace SortRig.Simulator.Physics;

/// <summary>
/// Platinum resistance thermometer characteristic, IEC 60751:2008 eq. (1) and (2):
/// R(t) = R0 [1 + A t + B t^2 + C (t - 100) t^3], with C = 0 for t &gt;= 0 degC.
/// </summary>
internal static class CallendarVanDusen
{
    public const double A = 3.9083e-3;
    public const double B = -5.775e-7;
    public const double C = -4.183e-12;

    /// <summary>Resistance in ohms at a temperature in degC (valid -200 to 850 degC).</summary>
    public static double Ohms(double celsius, double r0 = 100.0)
    {
        var t = celsius;
        var c = t < 0 ? C : 0.0;
        return r0 * (1 + (A * t) + (B * t * t) + (c * (t - 100) * t * t * t));
    }
}
