using SortRig.Planning.Assembly;

namespace SortRig.Planning.Ordering;

/// <summary>What an order estimate simulates. Validated at construction.</summary>
public sealed record OrderOptions
{
    /// <summary>Confidence levels every estimate reports: 90, 95 and 99 %.</summary>
    public static IReadOnlyList<double> Levels { get; } = [0.90, 0.95, 0.99];

    /// <summary>The assembler setting trials use by default: the window sweep alone (no exact search, no time-limited
    /// search), so every trial is fast and repeatable by seed. It never finds more sets than the full search, so the
    /// quantities it asks for are on the safe side.</summary>
    public static AssemblyOptions FastAssembly { get; } =
        new(exactPartLimit: 0, timeLimit: TimeSpan.Zero, neighbourhoodParts: 0);

    /// <summary>Creates validated options.</summary>
    /// <param name="setsWanted">Sets to build, 1 to 10 000.</param>
    /// <param name="stock">Distribution of the bought parts' values.</param>
    /// <param name="transferUncertainty">Expanded (k = 2) transfer uncertainty of each measurement, relative; 0 to
    /// 0.01, default 20e-6 (20 ppm).</param>
    /// <param name="trials">Monte Carlo trials, 1 to 100 000; default 1 000.</param>
    /// <param name="seed">Seed; the same seed and inputs give the same estimate. Default 1.</param>
    /// <param name="maxParts">Most parts one trial may buy (all nominals), 1 to 1 000 000; default 20 000. A trial that
    /// cannot make the sets within it counts as not reached.</param>
    /// <param name="curvePoints">Points on the sets-versus-parts curve, 2 to 50; default 8.</param>
    /// <param name="prices">Unit prices by quantity break per nominal (ohms); null or missing nominals for no
    /// cost.</param>
    /// <param name="assembly">Assembler limits for each trial; null for <see cref="FastAssembly"/>.</param>
    /// <param name="maxParallelism">Trials run at once, 1 to 64; default the processor count.</param>
    /// <param name="progress">Receives progress after every 5 % of trials; null for none.</param>
    /// <param name="perNominal">After the joint answer, trim each nominal's quantity in turn to the smallest that still
    /// makes the sets in at least the level's share of the same trials; default false (quantities in per-set
    /// proportion).</param>
    public OrderOptions(
        int setsWanted,
        StockDistribution stock,
        double transferUncertainty = 20e-6,
        int trials = 1000,
        int seed = 1,
        int maxParts = 20_000,
        int curvePoints = 8,
        IReadOnlyDictionary<double, PriceBreaks>? prices = null,
        AssemblyOptions? assembly = null,
        int? maxParallelism = null,
        IProgress<OrderProgress>? progress = null,
        bool perNominal = false
    )
    {
        PerNominal = perNominal;
        ArgumentNullException.ThrowIfNull(stock);
        SetsWanted = setsWanted is >= 1 and <= 10_000
            ? setsWanted
            : throw new OrderRefusedException(
                FormattableString.Invariant($"sets: {setsWanted} is not a number of sets to build (1 to 10 000)")
            );
        TransferUncertainty = transferUncertainty is >= 0 and <= 0.01
            ? transferUncertainty
            : throw new OrderRefusedException(
                FormattableString.Invariant(
                    $"uncertainty: {transferUncertainty * 1e6:0.###} ppm is outside 0 to 10 000 ppm"
                )
            );
        Trials = trials is >= 1 and <= 100_000
            ? trials
            : throw new OrderRefusedException(FormattableString.Invariant($"trials: {trials} is outside 1 to 100 000"));
        MaxParts = maxParts is >= 1 and <= 1_000_000
            ? maxParts
            : throw new OrderRefusedException(
                FormattableString.Invariant($"max-parts: {maxParts} is outside 1 to 1 000 000")
            );
        CurvePoints = curvePoints is >= 2 and <= 50
            ? curvePoints
            : throw new OrderRefusedException(
                FormattableString.Invariant($"curve points: {curvePoints} is outside 2 to 50")
            );
        MaxParallelism = maxParallelism ?? Environment.ProcessorCount;
        if (MaxParallelism is < 1 or > 64)
        {
            throw new OrderRefusedException(
                FormattableString.Invariant($"parallelism: {MaxParallelism} is outside 1 to 64")
            );
        }

        Stock = stock;
        Seed = seed;
        Prices = prices ?? new Dictionary<double, PriceBreaks>();
        Assembly = assembly ?? FastAssembly;
        Progress = progress;
    }

    /// <summary>Sets to build (1–10 000).</summary>
    public int SetsWanted { get; }

    /// <summary>Distribution of the bought parts' values.</summary>
    public StockDistribution Stock { get; }

    /// <summary>Expanded transfer uncertainty, relative (default 20 ppm).</summary>
    public double TransferUncertainty { get; }

    /// <summary>Monte Carlo trials (default 1 000).</summary>
    public int Trials { get; }

    /// <summary>Seed (default 1).</summary>
    public int Seed { get; }

    /// <summary>Most parts one trial may buy (default 20 000).</summary>
    public int MaxParts { get; }

    /// <summary>Points on the sets-versus-parts curve (default 8).</summary>
    public int CurvePoints { get; }

    /// <summary>Unit prices per nominal (ohms → breaks); empty for none.</summary>
    public IReadOnlyDictionary<double, PriceBreaks> Prices { get; }

    /// <summary>Assembler limits per trial (default <see cref="FastAssembly"/>).</summary>
    public AssemblyOptions Assembly { get; }

    /// <summary>Trials run at once.</summary>
    public int MaxParallelism { get; }

    /// <summary>Progress receiver, or null.</summary>
    public IProgress<OrderProgress>? Progress { get; }

    /// <summary>True to trim each nominal's quantity after the joint answer (default false).</summary>
    public bool PerNominal { get; }
}

/// <summary>Progress of an estimate.</summary>
/// <param name="Phase">"quantities" (finding each trial's smallest order) or "leftovers and curve".</param>
/// <param name="Done">Trials done in this phase.</param>
/// <param name="Total">Trials in all.</param>
/// <param name="Elapsed">Time since the estimate started.</param>
public sealed record OrderProgress(string Phase, int Done, int Total, TimeSpan Elapsed);

/// <summary>An order or reach question that has no answer, with the reason (a recipe the stock cannot meet, zero sets,
/// a tolerance tighter than the meter resolves). The message names the input at fault.</summary>
public sealed class OrderRefusedException : ArgumentException
{
    /// <summary>Creates the refusal.</summary>
    public OrderRefusedException() { }

    /// <summary>Creates the refusal with its reason.</summary>
    public OrderRefusedException(string message)
        : base(message) { }

    /// <summary>Creates the refusal with its reason and cause.</summary>
    public OrderRefusedException(string message, Exception innerException)
        : base(message, innerException) { }
}
