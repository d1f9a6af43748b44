namespace SortRig.Simulator.Physics;

/// <summary>What the meter input sees at one instant: an open circuit or a resistance.</summary>
/// <param name="IsOpen">True when nothing (or a bouncing contact) connects the terminals.</param>
/// <param name="Ohms">The resistance across the terminals when not open, in ohms.</param>
internal readonly record struct InputSample(bool IsOpen, double Ohms)
{
    public static InputSample Open => new(true, double.PositiveInfinity);

    public static InputSample Of(double ohms) => new(false, ohms);
}
