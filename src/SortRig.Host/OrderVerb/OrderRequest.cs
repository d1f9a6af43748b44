namespace SortRig.Host.OrderVerb;

/// <summary>An order request (the order verb).</summary>
/// <param name="Recipe">Recipe file, or a name under recipes/.</param>
/// <param name="Sets">Sets wanted.</param>
/// <param name="Stock">normal, uniform or bimodal; ignored when the values come from a session or the library.</param>
/// <param name="Tolerance">Stock tolerance, fraction.</param>
/// <param name="Gap">Bimodal: missing centre as a fraction of the tolerance.</param>
/// <param name="Uncertainty">Expanded transfer uncertainty, fraction; null when <paramref name="Meter"/> gives it (or
/// the default).</param>
/// <param name="Meter">Meter profile name or file whose transfer uncertainty at <paramref name="Nplc"/> is used; null
/// for none.</param>
/// <param name="Nplc">NPLC for <paramref name="Meter"/>.</param>
/// <param name="Database">SQLite path or PostgreSQL connection string, for <paramref name="FromSession"/> or <paramref
/// name="FromLibrary"/>.</param>
/// <param name="FromSession">Take the value distribution from this session's parts; null for none.</param>
/// <param name="FromLibrary">Take the value distribution from the library's available parts.</param>
/// <param name="Trials">Monte Carlo trials.</param>
/// <param name="Seed">Seed.</param>
/// <param name="MaxParts">Part cap per trial.</param>
/// <param name="PricesFile">YAML file of unit prices per quantity break; null for none.</param>
/// <param name="Price">Quantity breaks for every nominal without its own list ("1:0.10,100:0.05"); null for
/// none.</param>
/// <param name="CsvPath">Order CSV; null for none.</param>
/// <param name="CurveCsvPath">Curve CSV; null for none.</param>
/// <param name="PlotPath">PNG of sets against parts bought; null for none.</param>
/// <param name="TimeLimit">Assembler search time per trial; null for the fast sweep (repeatable).</param>
/// <param name="PerNominal">Trim each nominal's quantity after the joint answer.</param>
internal sealed record OrderRequest(
    string Recipe,
    int Sets,
    string Stock = "normal",
    double Tolerance = 0.01,
    double Gap = 0.4,
    double? Uncertainty = null,
    string? Meter = null,
    double Nplc = 1,
    string Database = "sortrig.db",
    string? FromSession = null,
    bool FromLibrary = false,
    int Trials = 1000,
    int Seed = 1,
    int MaxParts = 20_000,
    string? PricesFile = null,
    string? Price = null,
    string? CsvPath = null,
    string? CurveCsvPath = null,
    string? PlotPath = null,
    TimeSpan? TimeLimit = null,
    bool PerNominal = false
);
