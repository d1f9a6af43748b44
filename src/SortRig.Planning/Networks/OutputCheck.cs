namespace SortRig.Planning.Networks;

/// <summary>One output of a set judged against its spec.</summary>
/// <param name="Name">Output name from the recipe.</param>
/// <param name="Value">Computed value (volts for a node voltage, a plain ratio for ratios and gains).</param>
/// <param name="Target">Target value, same unit as <paramref name="Value"/>.</param>
/// <param name="Error">Error against the target in <paramref name="Unit"/> (volts, or ppm of the target).</param>
/// <param name="WorstCaseError">|Error| plus the parts' expanded transfer uncertainties carried through the
/// sensitivities (Σ |∂Error/∂R| U), in <paramref name="Unit"/>.</param>
/// <param name="Tolerance">Half-width of the spec in <paramref name="Unit"/>.</param>
/// <param name="Unit">"V" or "ppm".</param>
public sealed record OutputCheck(
    string Name,
    double Value,
    double Target,
    double Error,
    double WorstCaseError,
    double Tolerance,
    string Unit
)
{
    /// <summary>True when the spec is met in the worst case.</summary>
    public bool Meets => WorstCaseError <= Tolerance;

    /// <summary>Worst-case error as a fraction of the tolerance (≤ 1 meets the spec).</summary>
    public double Score => WorstCaseError / Tolerance;
}
