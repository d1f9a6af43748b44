namespace SortRig.Simulator.Physics;

/// <summary>What the meter input sees at one instant: an open circuit or a resistance.</summary>
/// <param name="IsOpen">True when nothing (or a bouncing contact) connects the terminals.</param>
/// <param name="Ohms">The resistance across the terminals when not open, in ohms.</param>
/// <param name="HeatingKelvinPerWatt">Rich model: the part's temperature rise per watt of test power reached so far,
/// K/W (θ (1 − e^(−t/τ))); 0 when self-heating is not modelled.</param>
/// <param name="TempcoPpmPerKelvin">The part's tempco, for the self-heating; 0 when not modelled.</param>
internal readonly record struct InputSample(
    bool IsOpen,
    double Ohms,
    double HeatingKelvinPerWatt = 0,
    double TempcoPpmPerKelvin = 0
)
{
    public static InputSample Open => new(true, double.PositiveInfinity);

    public static InputSample Of(double ohms) => new(false, ohms);
}
