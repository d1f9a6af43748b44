namespace SortRig.Simulator.Physics;

/// <summary>
/// Newton cooling of a handled part: T(t) = T_amb(t) + dT0 exp(-(t - t_ins) / tau).
/// The part follows slow ambient changes at once (the ambient moves over hours, tau is seconds);
/// only the handling excess decays.
/// </summary>
internal static class PartThermal
{
    public static double Celsius(double ambientCelsius, double warmKelvinAtInsertion, TimeSpan sinceInsertion, TimeSpan timeConstant)
    {
        var elapsed = Math.Max(0, sinceInsertion.TotalSeconds);
        return ambientCelsius + (warmKelvinAtInsertion * Math.Exp(-elapsed / timeConstant.TotalSeconds));
    }
}
