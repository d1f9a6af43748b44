namespace SortRig.Simulator.Physics;

/// <summary>
/// The bench physics model and the figures of the rich model (all invented for the simulator, not taken from any
/// instrument or part data sheet). With <see cref="Model"/> Simple the other figures are ignored and the bench
/// behaves exactly as before they existed. Validate with <see cref="Validate"/>.
/// </summary>
public sealed record PhysicsSpec
{
    /// <summary>Which physics runs. Default Simple.</summary>
    public PhysicsModel Model { get; init; } = PhysicsModel.Simple;

    /// <summary>Smallest share of the handling warmth that leaves by the fast path (leads into the fixture); 0 to 1.
    /// Default 0.2.</summary>
    public double LeadShareMin { get; init; } = 0.2;

    /// <summary>Largest such share; LeadShareMin to 1. Default 0.5.</summary>
    public double LeadShareMax { get; init; } = 0.5;

    /// <summary>Smallest ratio of the lead path's time constant to the body's; 0.01 to 1. Default 0.15.</summary>
    public double LeadTimeRatioMin { get; init; } = 0.15;

    /// <summary>Largest such ratio; LeadTimeRatioMin to 1. Default 0.35.</summary>
    public double LeadTimeRatioMax { get; init; } = 0.35;

    /// <summary>Thermal resistance of a part in the fixture, K/W, for self-heating by the test current; 0 to 10 000.
    /// Default 100.</summary>
    public double ThermalResistanceKelvinPerWatt { get; init; } = 100;

    /// <summary>RMS of the slow ambient wander (periods 5 to 60 min), K; 0 to 5. Default 0.1.</summary>
    public double AmbientWanderKelvin { get; init; } = 0.1;

    /// <summary>RMS of the low-frequency excess noise of a part (1/f-like over 0.1 to 100 s), ppm of its value; 0 to
    /// 100. Default 0.3.</summary>
    public double FlickerPpm { get; init; } = 0.3;

    /// <summary>The correlation times of the excess noise's four Ornstein-Uhlenbeck components, s, each carrying a
    /// quarter of <see cref="FlickerPpm"/>'s variance (a sum of Lorentzians one decade apart; common practice, no
    /// source).</summary>
    public static IReadOnlyList<double> FlickerTimeConstants { get; } = [0.1, 1, 10, 100];

    /// <summary>Share of parts that show popcorn (burst) noise; 0 to 1. Default 0.1.</summary>
    public double PopcornShare { get; init; } = 0.1;

    /// <summary>Height of a popcorn step, ppm of the part's value; 0 to 1000. Default 4.</summary>
    public double PopcornPpm { get; init; } = 4;

    /// <summary>Mean time between popcorn steps of a popcorn part; 0.1 s to 1 h. Default 6 s.</summary>
    public TimeSpan PopcornDwell { get; init; } = TimeSpan.FromSeconds(6);

    /// <summary>Throws naming the first invalid figure and its valid range.</summary>
    public PhysicsSpec Validate()
    {
        if (!Enum.IsDefined(Model))
        {
            throw new ArgumentOutOfRangeException(
                "PhysicsSpec.Model",
                Model,
                "PhysicsSpec.Model must be Simple or Rich."
            );
        }

        OptionGuard.InRange(LeadShareMin, 0, 1, "PhysicsSpec.LeadShareMin");
        OptionGuard.InRange(LeadShareMax, LeadShareMin, 1, "PhysicsSpec.LeadShareMax");
        OptionGuard.InRange(LeadTimeRatioMin, 0.01, 1, "PhysicsSpec.LeadTimeRatioMin");
        OptionGuard.InRange(LeadTimeRatioMax, LeadTimeRatioMin, 1, "PhysicsSpec.LeadTimeRatioMax");
        OptionGuard.InRange(
            ThermalResistanceKelvinPerWatt,
            0,
            10_000,
            "PhysicsSpec.ThermalResistanceKelvinPerWatt",
            "K/W"
        );
        OptionGuard.InRange(AmbientWanderKelvin, 0, 5, "PhysicsSpec.AmbientWanderKelvin", "K");
        OptionGuard.InRange(FlickerPpm, 0, 100, "PhysicsSpec.FlickerPpm", "ppm");
        OptionGuard.InRange(PopcornShare, 0, 1, "PhysicsSpec.PopcornShare");
        OptionGuard.InRange(PopcornPpm, 0, 1000, "PhysicsSpec.PopcornPpm", "ppm");
        OptionGuard.InRange(PopcornDwell, TimeSpan.FromSeconds(0.1), TimeSpan.FromHours(1), "PhysicsSpec.PopcornDwell");
        return this;
    }

    /// <summary>True when the rich model runs.</summary>
    internal bool IsRich => Model == PhysicsModel.Rich;
}
