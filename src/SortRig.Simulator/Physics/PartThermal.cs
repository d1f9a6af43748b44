namespace SortRig.Simulator.Physics;

/// <summary>
/// Cooling of a handled part. Simple model: Newton cooling, T(t) = T_amb(t) + dT0 exp(-(t - t_ins) / tau).
/// Rich model: two paths, T(t) = T_amb(t) + dT0 ((1 - w) exp(-t / tau) + w exp(-t / tau_lead)), w the share of the
/// warmth that the leads carry into the fixture. The part follows slow ambient changes at once (the ambient moves
/// over minutes to hours, tau is seconds); only the handling excess decays.
/// </summary>
internal static class PartThermal
{
    public static double Celsius(
        double ambientCelsius,
        double warmKelvinAtInsertion,
        TimeSpan sinceInsertion,
        TimeSpan timeConstant
    )
    {
        var elapsed = Math.Max(0, sinceInsertion.TotalSeconds);
        return ambientCelsius + (warmKelvinAtInsertion * Math.Exp(-elapsed / timeConstant.TotalSeconds));
    }

    /// <summary>The part's temperature with its own thermal paths (one or two).</summary>
    public static double Celsius(
        SimulatedPart part,
        double ambientCelsius,
        double warmKelvinAtInsertion,
        TimeSpan sinceInsertion
    )
    {
        if (part.LeadShare == 0)
        {
            return Celsius(ambientCelsius, warmKelvinAtInsertion, sinceInsertion, part.ThermalTimeConstant);
        }

        var t = Math.Max(0, sinceInsertion.TotalSeconds);
        var w = part.LeadShare;
        var body = (1 - w) * Math.Exp(-t / part.ThermalTimeConstant.TotalSeconds);
        var leads = w * Math.Exp(-t / part.LeadTimeConstant.TotalSeconds);
        return ambientCelsius + (warmKelvinAtInsertion * (body + leads));
    }

    /// <summary>Rich model: temperature rise per watt of test power reached after a time in the fixture, K/W.</summary>
    public static double HeatingPerWatt(SimulatedPart part, double thermalResistance, TimeSpan sinceInsertion) =>
        thermalResistance
        * (1 - Math.Exp(-Math.Max(0, sinceInsertion.TotalSeconds) / part.ThermalTimeConstant.TotalSeconds));

    /// <summary>Rich model: draws each part's lead share and lead time constant from its own stream (the reel's draws
    /// are untouched).</summary>
    public static IReadOnlyList<SimulatedPart> Enrich(IReadOnlyList<SimulatedPart> parts, PhysicsSpec physics, int seed)
    {
        if (!physics.IsRich)
        {
            return parts;
        }

        var rng = new MathNet.Numerics.Random.MersenneTwister(seed, threadSafe: false);
        return [.. parts.Select(p => Enrich(p, physics, rng))];
    }

    public static SimulatedPart Enrich(SimulatedPart part, PhysicsSpec physics, Random rng)
    {
        var share = physics.LeadShareMin + (rng.NextDouble() * (physics.LeadShareMax - physics.LeadShareMin));
        var ratio =
            physics.LeadTimeRatioMin + (rng.NextDouble() * (physics.LeadTimeRatioMax - physics.LeadTimeRatioMin));
        return part with { LeadShare = share, LeadTimeConstant = part.ThermalTimeConstant * ratio };
    }
}
