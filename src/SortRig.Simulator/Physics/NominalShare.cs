namespace SortRig.Simulator.Physics;

/// <summary>One nominal value on a mixed reel and its share of the parts.</summary>
/// <param name="Ohms">Nominal value in ohms, 0.1 to 100 000 000.</param>
/// <param name="Weight">Relative share (any positive number; shares are normalised over the reel).</param>
public sealed record NominalShare(double Ohms, double Weight);
