namespace SortRig.Simulator.Physics;

/// <summary>
/// Room temperature around the bench: T(t) = Mean + Swing sin(2 pi t / Period + phase), t since the bench epoch.
/// A zero swing gives a constant ambient.
/// </summary>
public sealed record AmbientSpec
{
    /// <summary>Mean ambient in degC; -100 to 200 (wide so that the Pt100 channel can be exercised). Default
    /// 23.</summary>
    public double MeanCelsius { get; init; } = 23.0;

    /// <summary>Amplitude of the sinusoidal swing in K; 0 to 30. Default 0 (constant).</summary>
    public double SwingKelvin { get; init; }

    /// <summary>Period of the swing; 1 min to 7 days. Default 24 h (a day/night cycle).</summary>
    public TimeSpan Period { get; init; } = TimeSpan.FromHours(24);

    /// <summary>Phase of the swing at the epoch, in degrees; -360 to 360. Default 0.</summary>
    public double PhaseDegrees { get; init; }

    /// <summary>Throws naming the first invalid option and its valid range.</summary>
    public AmbientSpec Validate()
    {
        OptionGuard.InRange(MeanCelsius, -100, 200, "AmbientSpec.MeanCelsius", "degC");
        OptionGuard.InRange(SwingKelvin, 0, 30, "AmbientSpec.SwingKelvin", "K");
        OptionGuard.InRange(Period, TimeSpan.FromMinutes(1), TimeSpan.FromDays(7), "AmbientSpec.Period");
        OptionGuard.InRange(PhaseDegrees, -360, 360, "AmbientSpec.PhaseDegrees", "deg");
        return this;
    }

    /// <summary>Ambient in degC at a time since the epoch.</summary>
    public double CelsiusAt(TimeSpan sinceEpoch) =>
        MeanCelsius
        + (
            SwingKelvin
            * Math.Sin((2 * Math.PI * sinceEpoch.TotalSeconds / Period.TotalSeconds) + (PhaseDegrees * Math.PI / 180))
        );
}
