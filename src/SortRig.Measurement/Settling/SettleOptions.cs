using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>Options of the settle rule. Each property is validated when set; see docs/measurement.md.</summary>
public sealed record SettleOptions
{
    private readonly int _windowLength = 8;
    private readonly int _minReadings = 8;
    private readonly SettleTarget _target = SettleTarget.Ppm(10);
    private readonly double _slopeAlpha = 0.05;
    private readonly double _slopeFraction = 0.5;
    private readonly TimeSpan _bounceIgnore = TimeSpan.FromMilliseconds(50);
    private readonly TimeSpan _maxSettleTime = TimeSpan.FromSeconds(20);
    private readonly int _removalOverloads = 2;
    private readonly int _noiseHistory = 64;
    private readonly SpecPeriod _specPeriod = SpecPeriod.Year1;
    private readonly UncertaintyModel _model = UncertaintyModel.Default;
    private readonly TimeSpan _assumedTimeConstant = TimeSpan.FromSeconds(5);
    private readonly TimeSpan _settlingSpan = TimeSpan.Zero;

    /// <summary>The default options.</summary>
    public static SettleOptions Default { get; } = new();

    /// <summary>Readings in the judged window (N). Default 8; valid [3, 1000].</summary>
    public int WindowLength
    {
        get => _windowLength;
        init => _windowLength = Check(value, 3, 1000, nameof(WindowLength));
    }

    /// <summary>Finite readings after the bounce before acceptance is possible; at least N are always needed.
    /// Default 8; valid [1, 100000].</summary>
    public int MinReadings
    {
        get => _minReadings;
        init => _minReadings = Check(value, 1, 100_000, nameof(MinReadings));
    }

    /// <summary>Target standard error of the window mean, ohms or ppm. Default 10 ppm; must be &gt; 0.</summary>
    public SettleTarget Target
    {
        get => _target;
        init =>
            _target = value.IsValid
                ? value
                : throw new ArgumentOutOfRangeException(nameof(Target), value, "Target must be > 0 ohms or ppm.");
    }

    /// <summary>Significance level of the two-sided t test on the window's regression slope. Default 0.05; valid (0,
    /// 0.5].</summary>
    public double SlopeAlpha
    {
        get => _slopeAlpha;
        init =>
            _slopeAlpha = value is > 0 and <= 0.5
                ? value
                : throw new ArgumentOutOfRangeException(nameof(SlopeAlpha), value, "SlopeAlpha must be in (0, 0.5].");
    }

    /// <summary>|slope| × window duration must not exceed this fraction of the target. Default 0.5; valid (0,
    /// 10].</summary>
    public double SlopeFractionOfTarget
    {
        get => _slopeFraction;
        init =>
            _slopeFraction = value is > 0 and <= 10
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(SlopeFractionOfTarget),
                    value,
                    "SlopeFractionOfTarget must be in (0, 10]."
                );
    }

    /// <summary>Readings within this time of the insertion are ignored (contact bounce). Default 50 ms; valid [0, 10
    /// s].</summary>
    public TimeSpan BounceIgnore
    {
        get => _bounceIgnore;
        init =>
            _bounceIgnore =
                value >= TimeSpan.Zero && value <= TimeSpan.FromSeconds(10)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(BounceIgnore),
                        value,
                        "BounceIgnore must be in [0, 10 s]."
                    );
    }

    /// <summary>Longest time from insertion to a verdict before the part is declared unstable. Default 20 s; valid (0,
    /// 1 h].</summary>
    public TimeSpan MaxSettleTime
    {
        get => _maxSettleTime;
        init =>
            _maxSettleTime =
                value > TimeSpan.Zero && value <= TimeSpan.FromHours(1)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(MaxSettleTime),
                        value,
                        "MaxSettleTime must be in (0, 1 h]."
                    );
    }

    /// <summary>Consecutive overload readings (after the bounce) that mean the part was removed. Default 2; valid [1,
    /// 100].</summary>
    public int RemovalOverloads
    {
        get => _removalOverloads;
        init => _removalOverloads = Check(value, 1, 100, nameof(RemovalOverloads));
    }

    /// <summary>
    /// Successive differences kept for the robust noise guard: the judged SEM is the larger of the window's s/√N
    /// and the guard's σ/√N. Default 64; valid [0, 10000]; 0 judges the window alone.
    /// </summary>
    public int NoiseHistoryLength
    {
        get => _noiseHistory;
        init => _noiseHistory = Check(value, 0, 10_000, nameof(NoiseHistoryLength));
    }

    /// <summary>
    /// Assumed upper bound of the time constant with which a handled part's excess temperature, and so its excess
    /// resistance, decays (an engineering assumption, not a measured figure: it covers the simulator's 3.2–4.8 s;
    /// set it for the parts and fixture at hand). The remaining excess of a settling exponential is |slope| × τ, so
    /// an accepted value carries a residual-settling component, rectangular with half-width
    /// a = (|b| + t·SE(b)) × this, b the regression slope (of the window, or of the settling span when set), in its
    /// absolute and transfer uncertainties. Default 5 s; valid [0, 10 min]; 0 leaves the component out.
    /// </summary>
    public TimeSpan AssumedTimeConstant
    {
        get => _assumedTimeConstant;
        init =>
            _assumedTimeConstant =
                value >= TimeSpan.Zero && value <= TimeSpan.FromMinutes(10)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(AssumedTimeConstant),
                        value,
                        "AssumedTimeConstant must be in [0, 10 min]."
                    );
    }

    /// <summary>
    /// When &gt; 0 the slope is also fitted over the finite readings of the last SettlingSpan (since the bounce or the
    /// last flicker; never fewer than the window), and a part is accepted only when the residual half-width a of that
    /// fit (see <see cref="AssumedTimeConstant"/>) is within the target: a bounded, budgeted residual replaces the
    /// slope significance test. Default 0 (off: the window's slope test alone); valid [0, 10 min]; needs
    /// AssumedTimeConstant &gt; 0.
    /// </summary>
    public TimeSpan SettlingSpan
    {
        get => _settlingSpan;
        init =>
            _settlingSpan =
                value >= TimeSpan.Zero && value <= TimeSpan.FromMinutes(10)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(SettlingSpan),
                        value,
                        "SettlingSpan must be in [0, 10 min]."
                    );
    }

    /// <summary>
    /// When set, the predictive rule runs beside the averaging rule: it fits the recovery as it comes in and may accept
    /// a part earlier with the extrapolated final value (<see cref="SettleRule.Predictive"/>); when no model fits, the
    /// averaging rule decides as before. Default null (averaging rule only).
    /// </summary>
    public PredictiveOptions? Predictive { get; init; }

    /// <summary>True when the fixture is wired 4-wire (default); false adds the lead term to accepted values.</summary>
    public bool FourWire { get; init; } = true;

    /// <summary>Which accuracy spec applies to accepted values. Default Year1.</summary>
    public SpecPeriod SpecPeriod
    {
        get => _specPeriod;
        init =>
            _specPeriod = Enum.IsDefined(value)
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(SpecPeriod),
                    value,
                    "SpecPeriod must be Hours24 or Year1."
                );
    }

    /// <summary>Uncertainty model assumptions for accepted values. Default <see
    /// cref="UncertaintyModel.Default"/>.</summary>
    public UncertaintyModel Model
    {
        get => _model;
        init => _model = value ?? throw new ArgumentNullException(nameof(Model));
    }

    /// <summary>Finite readings needed before acceptance: max(MinReadings, WindowLength).</summary>
    public int RequiredReadings => Math.Max(MinReadings, WindowLength);

    private static int Check(int value, int min, int max, string name) =>
        value >= min && value <= max
            ? value
            : throw new ArgumentOutOfRangeException(name, value, $"{name} must be in [{min}, {max}].");
}
