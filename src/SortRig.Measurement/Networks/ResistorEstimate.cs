namespace SortRig.Measurement.Networks;

/// <summary>A resistance with its standard uncertainty, both in ohms.</summary>
/// <param name="Value">Resistance, ohms; finite and &gt; 0.</param>
/// <param name="StandardUncertainty">Standard uncertainty, ohms; finite and &gt;= 0.</param>
public readonly record struct ResistorEstimate(double Value, double StandardUncertainty);

/// <summary>
/// The value of a network with its first-order propagated standard uncertainty and the sensitivity
/// coefficient of each input (JCGM 100:2008 5.1.2, 5.1.3; inputs assumed uncorrelated).
/// </summary>
/// <param name="Value">Network resistance, ohms.</param>
/// <param name="StandardUncertainty">u_c, ohms.</param>
/// <param name="Sensitivities">∂R/∂R_i for each input in order, dimensionless.</param>
public sealed record NetworkValue(double Value, double StandardUncertainty, IReadOnlyList<double> Sensitivities);
