namespace SortRig.Simulator.Physics;

/// <summary>
/// One resistor on the virtual reel, with its hidden true properties.
/// </summary>
/// <param name="Index">Position on the reel, 0-based.</param>
/// <param name="NominalOhms">Marked value in ohms (e.g. 10 000).</param>
/// <param name="OhmsAt23C">True resistance at the 23 degC reference temperature, in ohms, at the reel epoch.</param>
/// <param name="TempcoPpmPerKelvin">Linear temperature coefficient alpha, in ppm/K.</param>
/// <param name="DriftPpmPerHour">Slow linear ageing drift, in ppm per hour since the reel epoch.</param>
/// <param name="ThermalTimeConstant">Time constant of the part's exponential cooling towards ambient.</param>
public sealed record SimulatedPart(
    int Index,
    double NominalOhms,
    double OhmsAt23C,
    double TempcoPpmPerKelvin,
    double DriftPpmPerHour,
    TimeSpan ThermalTimeConstant
)
{
    /// <summary>Rich model: share of the handling warmth carried off by the leads into the fixture, 0..1; 0 (default)
    /// for one path.</summary>
    public double LeadShare { get; init; }

    /// <summary>Rich model: time constant of the lead path; zero (default) when <see cref="LeadShare"/> is 0.</summary>
    public TimeSpan LeadTimeConstant { get; init; }

    /// <summary>The reference temperature of <see cref="OhmsAt23C"/>, in degC.</summary>
    public const double ReferenceCelsius = 23.0;

    /// <summary>
    /// True resistance in ohms at a body temperature and age:
    /// R = R23 (1 + alpha (T - 23)) (1 + drift h).
    /// </summary>
    /// <param name="celsius">Body temperature in degC.</param>
    /// <param name="hoursSinceEpoch">Hours since the reel epoch (bench start), for the drift term.</param>
    public double OhmsAt(double celsius, double hoursSinceEpoch) =>
        OhmsAt23C
        * (1.0 + (TempcoPpmPerKelvin * 1e-6 * (celsius - ReferenceCelsius)))
        * (1.0 + (DriftPpmPerHour * 1e-6 * hoursSinceEpoch));

    /// <summary>Deviation of <see cref="OhmsAt23C"/> from nominal, as a fraction (0.001 = 0.1 %).</summary>
    public double Deviation => (OhmsAt23C / NominalOhms) - 1.0;
}
