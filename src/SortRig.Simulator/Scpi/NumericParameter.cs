namespace SortRig.Simulator.Scpi;

/// <summary>How to read a numeric parameter: accepted suffixes and the values of MIN, MAX, DEF (null: not
/// accepted).</summary>
internal sealed record NumericParameter(
    IReadOnlyDictionary<string, double> Suffixes,
    double? Min,
    double? Max,
    double? Default
)
{
    private static readonly Dictionary<string, double> s_none = new(StringComparer.OrdinalIgnoreCase);

    /// <summary>Ohm suffixes; note MOHM is mega-ohm in SCPI (SCPI-99 vol. 1 sec. 7.7.3).</summary>
    private static readonly Dictionary<string, double> s_ohms = new(StringComparer.OrdinalIgnoreCase)
    {
        ["OHM"] = 1,
        ["KOHM"] = 1e3,
        ["MOHM"] = 1e6,
        ["GOHM"] = 1e9,
    };

    private static readonly Dictionary<string, double> s_seconds = new(StringComparer.OrdinalIgnoreCase)
    {
        ["S"] = 1,
        ["MS"] = 1e-3,
        ["US"] = 1e-6,
    };

    public static NumericParameter Plain { get; } = new(s_none, null, null, null);

    public static NumericParameter Ohms(double? min, double? max, double? def) => new(s_ohms, min, max, def);

    public static NumericParameter Seconds(double? min, double? max, double? def) => new(s_seconds, min, max, def);

    public static NumericParameter Unitless(double? min, double? max, double? def) => new(s_none, min, max, def);
}
