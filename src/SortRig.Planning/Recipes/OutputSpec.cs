namespace SortRig.Planning.Recipes;

/// <summary>A node voltage, or the difference of two node voltages ("a - b"), in a network recipe.</summary>
/// <param name="Plus">Node whose voltage is taken.</param>
/// <param name="Minus">Node subtracted, or null for a voltage to ground.</param>
public sealed record NodeProbe(string Plus, string? Minus)
{
    /// <inheritdoc />
    public override string ToString() => Minus is null ? Plus : $"{Plus} - {Minus}";
}

/// <summary>One acceptance spec of a network recipe. Targets default to the circuit's value with nominal
/// parts.</summary>
/// <param name="Name">Output name, unique in the recipe.</param>
/// <param name="Drive">Source voltages (volts, by source name) overriding the netlist's for this output; empty for
/// none.</param>
public abstract record OutputSpec(string Name, IReadOnlyDictionary<string, double> Drive);

/// <summary>A node voltage within ± a tolerance.</summary>
/// <param name="Name">Output name.</param>
/// <param name="Drive">Source voltage overrides, volts by source name.</param>
/// <param name="Node">Probed node or node difference.</param>
/// <param name="TargetVolts">Target, volts; null = the nominal circuit's value.</param>
/// <param name="ToleranceVolts">Half-width of the accepted band, volts (&gt; 0).</param>
public sealed record NodeVoltageSpec(
    string Name,
    IReadOnlyDictionary<string, double> Drive,
    NodeProbe Node,
    double? TargetVolts,
    double ToleranceVolts
) : OutputSpec(Name, Drive);

/// <summary>A ratio of two probed voltages within ± a tolerance in ppm of the target (also used for a gain).</summary>
/// <param name="Name">Output name.</param>
/// <param name="Drive">Source voltage overrides, volts by source name.</param>
/// <param name="Numerator">Numerator probe (for a gain: the output node).</param>
/// <param name="Denominator">Denominator probe (for a gain: the input, e.g. "inp - inn").</param>
/// <param name="Target">Target ratio; null = the nominal circuit's ratio. Must not be 0.</param>
/// <param name="TolerancePpm">Half-width of the accepted band, ppm of the target (&gt; 0).</param>
public sealed record VoltageRatioSpec(
    string Name,
    IReadOnlyDictionary<string, double> Drive,
    NodeProbe Numerator,
    NodeProbe Denominator,
    double? Target,
    double TolerancePpm
) : OutputSpec(Name, Drive);

/// <summary>The ratio of two positions' resistances within ± a tolerance in ppm of the nominal ratio.</summary>
/// <param name="Name">Output name.</param>
/// <param name="Numerator">Numerator position name.</param>
/// <param name="Denominator">Denominator position name.</param>
/// <param name="TolerancePpm">Half-width of the accepted band, ppm (&gt; 0).</param>
public sealed record PositionRatioSpec(string Name, string Numerator, string Denominator, double TolerancePpm)
    : OutputSpec(Name, new Dictionary<string, double>());
