using System.ComponentModel.DataAnnotations;
using SortRig.Measurement.Settling;
using SortRig.Simulator.Physics;

namespace SortRig.Engine.Sorting;

/// <summary>
/// Settings of a sorting session, bound from the "Sort" configuration section (appsettings.json,
/// SORTRIG_Sort__* environment variables, command-line flags).
/// </summary>
public sealed class SortOptions
{
    /// <summary>Configuration section name.</summary>
    public const string Section = "Sort";

    /// <summary>VISA-style resource of the meter; empty runs the embedded simulator. Default empty.</summary>
    public string Resource { get; set; } = "";

    /// <summary>Meter profile file or family name under instruments/. Default "simulator".</summary>
    public string Profile { get; set; } = "simulator";

    /// <summary>Storage connection: a SQLite file path or "Data Source=..."; or a PostgreSQL "Host=..." string. Default
    /// sortrig.db.</summary>
    [Required]
    public string Database { get; set; } = "sortrig.db";

    /// <summary>Session name; restarting with the same name resumes an unfinished session. Default "bench".</summary>
    [Required]
    public string Session { get; set; } = "bench";

    /// <summary>Nominal value in ohms of the batch. Default 10 000.</summary>
    [Range(1e-3, 1e9)]
    public double Nominal { get; set; } = 10_000;

    /// <summary>Stock tolerance as a fraction (0.01 = 1 %). Default 0.01; 0 &lt; t &lt;= 0.2.</summary>
    [Range(1e-6, 0.2)]
    public double StockTolerance { get; set; } = 0.01;

    /// <summary>Match tolerance as a fraction (0.001 = 0.1 %). Default 0.001; must be below the stock
    /// tolerance.</summary>
    [Range(1e-7, 0.1)]
    public double MatchTolerance { get; set; } = 0.001;

    /// <summary>Number of cups besides the reject cup. Default 12; 1..26.</summary>
    [Range(1, 26)]
    public int Cups { get; set; } = 12;

    /// <summary>
    /// How parts are placed: bands (fixed bands of the match width around nominal), adaptive
    /// (band edges placed where the reel's values fall, learned from the first parts), or slots
    /// (numbered tray slots, for exact-value set assembly with the plan verb); bound case-insensitively.
    /// Default <see cref="AssignerKind.Bands"/>.
    /// </summary>
    [EnumDataType(typeof(AssignerKind), ErrorMessage = "Sort:Assigner must be bands, adaptive or slots.")]
    public AssignerKind Assigner { get; set; } = AssignerKind.Bands;

    /// <summary>Parts per matched set, for the adaptive planner's "set complete" call. Default 4; 1..64.</summary>
    [Range(1, 64)]
    public int PartsPerSet { get; set; } = 4;

    /// <summary>Integration time in power-line cycles. Default 1.</summary>
    [Range(0.001, 1000)]
    public double Nplc { get; set; } = 1;

    /// <summary>
    /// Range transfer when this batch sits on a higher meter range than the session's first batch (an R-2R
    /// ladder's 2R after its R): "auto" measures a bridging part when the two ranges' gain uncertainty does not
    /// fit the match band, "always" measures one whenever the ranges differ, "off" never (ratios across the ranges
    /// then carry the gain error); bound case-insensitively. Default <see cref="BridgeMode.Auto"/>. See
    /// docs/range-transfer.md.
    /// </summary>
    [EnumDataType(typeof(BridgeMode), ErrorMessage = "Sort:Bridge must be auto, always or off.")]
    public BridgeMode Bridge { get; set; } = BridgeMode.Auto;

    /// <summary>
    /// The check standard: "fixture:&lt;ohms&gt;" (a reference part kept at the fixture) or "library:&lt;part id&gt;";
    /// empty (default) for no check. Read at the session's start, on the cadence below and at the end
    /// (docs/checking.md).
    /// </summary>
    public string Check { get; set; } = "";

    /// <summary>Parts between checks. Default 25; 0 for no part count (then <see cref="CheckMinutes"/> must be set);
    /// 0..10 000.</summary>
    [Range(0, 10_000)]
    public int CheckEvery { get; set; } = 25;

    /// <summary>Minutes between checks (whichever of this and <see cref="CheckEvery"/> comes first). Default 0 (no
    /// clock); 0..1440.</summary>
    [Range(0, 1440)]
    public double CheckMinutes { get; set; }

    /// <summary>The check's calibrated value, ohms, for the meter's apparent gain; 0 (default) when unknown (a library
    /// check uses its logged value).</summary>
    [Range(0, 1e9)]
    public double CheckValue { get; set; }

    /// <summary>Least sigma of the check's control chart, ppm of its value (a meter that repeats exactly would give
    /// zero-width limits). Default 2 ppm; 0.01..1000.</summary>
    [Range(0.01, 1000)]
    public double CheckSigmaFloorPpm { get; set; } = 2;

    /// <summary>Readings the check's limits need before the chart judges; a check with less history is re-seated
    /// and read at the session's start until it has them. Default 5; 2..50.</summary>
    [Range(2, 50)]
    public int CheckBaseline { get; set; } = 5;

    /// <summary>
    /// Which settle rule accepts parts: averaging (the mean of the last readings once they stopped moving) or
    /// predictive (also fits each part's thermal recovery and may accept earlier with the extrapolated final value;
    /// the averaging rule decides whenever no model fits); bound case-insensitively. Default
    /// <see cref="SettleRule.Predictive"/>: the fastest rule that holds the false-accept bound (at most 0.1 % of values
    /// outside 2 × the settle target, 95 % upper bound) on every case of the settle benchmark, pooled over the
    /// benchmark's reel and ten more per case (docs/bench-settle.md, tenth pass); the averaging rule stays selectable.
    /// </summary>
    [EnumDataType(typeof(SettleRule), ErrorMessage = "Sort:Settle must be averaging or predictive.")]
    public SettleRule Settle { get; set; } = SettleRule.Predictive;

    /// <summary>
    /// Carry on the latest session of this name even if it was finished (its parts reached <see cref="Parts"/>, or
    /// the operator finished it): numbering continues and a new batch starts when the nominal or setup differs,
    /// so an R-2R ladder's 2R can follow its R in one session. <see cref="Parts"/> then counts the whole session.
    /// Default false (a finished session's name starts a new session).
    /// </summary>
    public bool Reopen { get; set; }

    /// <summary>Measure 4-wire. Default false (a two-clip fixture).</summary>
    public bool FourWire { get; set; }

    /// <summary>
    /// Parts to sort before the session ends by itself (the demo reel's length on the simulator);
    /// 0 sorts until the operator finishes (a real meter) or 60 parts (the simulator). Default 0; 0..1 000 000.
    /// </summary>
    [Range(0, 1_000_000)]
    public int Parts { get; set; }

    /// <summary>
    /// Typed meter only (resource TYPED::profile): entries in a row, a few seconds apart, that must agree within one
    /// digit before a part is accepted. Default 2; 2..10. See docs/instruments.md, "Typed readings".
    /// </summary>
    [Range(2, 10)]
    public int Agree { get; set; } = 2;

    /// <summary>Typed meter only: least time between two counted entries, in seconds (let go, wait, read again).
    /// Default 3; 0..60.</summary>
    [Range(0, 60)]
    public double Gap { get; set; } = 3;

    /// <summary>Simulator only: random seed of the demo reel. Default 2026.</summary>
    public int Seed { get; set; } = 2026;

    /// <summary>
    /// Simulator only: the bench physics of the demo reel, simple (one cooling path per part, white noise) or rich
    /// (two thermal paths, self-heating, ambient wander, excess and popcorn noise); bound case-insensitively.
    /// Default <see cref="PhysicsModel.Simple"/>. See docs/simulator.md, "Physics models".
    /// </summary>
    [EnumDataType(typeof(PhysicsModel), ErrorMessage = "Sort:Physics must be simple or rich.")]
    public PhysicsModel Physics { get; set; } = PhysicsModel.Simple;

    /// <summary>Simulator only: how many times faster than the wall clock virtual time runs. Default 1;
    /// 1..1000.</summary>
    [Range(1, 1000)]
    public double Speed { get; set; } = 1;

    /// <summary>Simulator only: faults injected per 1000 exchanges. Default 0.</summary>
    [Range(0, 500)]
    public double FaultsPerThousand { get; set; }

    /// <summary>
    /// Recipe file (YAML, docs/planning.md) of the build to sort toward; empty sorts the whole reel. With a recipe the
    /// session stops as soon as <see cref="Sets"/> sets can be formed from the parts measured so far. Default empty.
    /// </summary>
    public string Recipe { get; set; } = "";

    /// <summary>Sets of <see cref="Recipe"/> to sort toward; 0 means 1 when a recipe is given. Default 0;
    /// 0..64.</summary>
    [Range(0, 64)]
    public int Sets { get; set; }

    /// <summary>Where the pick list is exported (CSV) once the sets are in hand; empty for SESSION-sets.csv in the
    /// working directory.</summary>
    public string SetsCsv { get; set; } = "";

    /// <summary>Show the live console view (otherwise one plain line per announcement). Default true when
    /// interactive.</summary>
    public bool? Live { get; set; }

    /// <summary>Keep serving the page after the session ends, until stopped (Ctrl+C). Default false.</summary>
    public bool StayAfterFinish { get; set; }

    /// <summary>Speak announcements with espeak-ng when installed. Default true.</summary>
    public bool Speech { get; set; } = true;
}
