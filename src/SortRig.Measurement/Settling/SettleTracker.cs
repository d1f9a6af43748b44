using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Settling;

/// <summary>
/// The settle rule: a pure state machine fed one reading at a time. Decides when a part in the fixture has
/// settled (regression slope not significant and small, standard error of the mean within target) and
/// accepts it once per insertion. Times come from the readings. Not thread-safe. See docs/measurement.md.
/// </summary>
public sealed partial class SettleTracker
{
    private readonly SettleOptions _options;
    private readonly RangeSpec _range;
    private readonly NplcSpec _nplc;
    private readonly double _criticalT;
    private readonly Queue<Reading> _window;
    private readonly NoiseGuard _noise;
    private readonly ResidualSettling _residual;
    private readonly PredictiveSettling? _predictive;
    private SettleState _state = SettleState.Empty;
    private DateTimeOffset? _insertedAt;
    private TimeSpan _excused;
    private DateTimeOffset? _lastTime;
    private double? _latestValue;
    private WindowStatistics? _stats;
    private int _collected;
    private int _overloadRun;
    private int _flickers;
    private int _slopeFailures;
    private int _noiseFailures;
    private bool _restartOnNextReading;

    /// <summary>Creates a tracker for readings taken on one range at one NPLC.</summary>
    /// <param name="range">The range the readings come from (for the uncertainty of accepted values).</param>
    /// <param name="nplc">The integration time they are taken at.</param>
    /// <param name="options">Settle options; <see cref="SettleOptions.Default"/> when null.</param>
    /// <param name="prior">What earlier parts of the session taught the predictive rule (<see cref="Prior"/>);
    /// <see cref="ReelPrior.Empty"/> when null.</param>
    public SettleTracker(RangeSpec range, NplcSpec nplc, SettleOptions? options = null, ReelPrior? prior = null)
    {
        _range = range ?? throw new ArgumentNullException(nameof(range));
        _nplc = nplc ?? throw new ArgumentNullException(nameof(nplc));
        _options = options ?? SettleOptions.Default;
        _criticalT = WindowStatistics.CriticalT(_options.WindowLength, _options.SlopeAlpha);
        _window = new Queue<Reading>(_options.WindowLength + 1);
        _noise = new NoiseGuard(_options.NoiseHistoryLength);
        _residual = new ResidualSettling(_options, _nplc.ResolutionPpmOfRange * 1e-6 * _range.FullScale);
        _predictive = _options.Predictive is { } predictive
            ? new PredictiveSettling(
                predictive,
                _nplc.ResolutionPpmOfRange * 1e-6 * _range.FullScale,
                _options.AssumedTimeConstant
            )
            : null;
        Prior = prior ?? ReelPrior.Empty;
        if (_predictive is not null && _options.AssumedTimeConstant < TimeSpan.FromSeconds(0.1))
        {
            throw new ArgumentException(
                "SettleOptions.Predictive needs SettleOptions.AssumedTimeConstant >= 0.1 s: it bounds the time "
                    + "constants the recovery fit may use.",
                nameof(options)
            );
        }

        if (_residual.SpanMode && _options.AssumedTimeConstant == TimeSpan.Zero)
        {
            throw new ArgumentException(
                $"SettleOptions.SettlingSpan ({_options.SettlingSpan.TotalSeconds:G4} s) needs "
                    + $"SettleOptions.AssumedTimeConstant > 0: the span's residual is judged in units of it.",
                nameof(options)
            );
        }
    }

    /// <summary>The tracker's standing state: Empty, Bouncing, Settling or AwaitingRemoval.</summary>
    public SettleState State => _state;

    /// <summary>
    /// The reel-learned prior of the predictive rule: what the parts accepted so far in this session say about the body
    /// time constant; updated on each acceptance (kept across <see cref="Reset"/>: it belongs to the reel, not to one
    /// part). Unused without <see cref="SettleOptions.Predictive"/>. Set it to go on from what an earlier run of the
    /// same reel learned (a resumed session); the teaching hold then follows the prior set.
    /// </summary>
    public ReelPrior Prior
    {
        get;
        set
        {
            ArgumentNullException.ThrowIfNull(value);
            field = value;
            _predictive?.BodyRange = value.BodyRange;
            _predictive?.BodyPrior = value.Body;
            _predictive?.Teaching =
                value.Count < ReelPrior.MinParts
                && value.Seen - value.Count < (_options.Predictive?.TeachingFailures ?? 0);
        }
    }

    /// <summary>The predictive rule's latest fit of the part in the fixture (accepted or not); null before the first
    /// or without <see cref="SettleOptions.Predictive"/>.</summary>
    public RecoveryFit? LatestFit => _predictive?.Latest;

    /// <summary>The options in force.</summary>
    public SettleOptions Options => _options;

    /// <summary>Feeds one reading and returns the verdict it leads to.</summary>
    /// <exception cref="ArgumentException">The reading is older than the previous one, is finite but not a number,
    /// or was taken on another range.</exception>
    public SettleVerdict Add(Reading reading)
    {
        var overload = Validate(reading);
        _lastTime = reading.Time;
        if (_restartOnNextReading)
        {
            _restartOnNextReading = false;
            _insertedAt = reading.Time;
        }

        switch (_state)
        {
            case SettleState.Empty when overload:
                return Verdict(SettleState.Empty, reading);
            case SettleState.Empty:
                _insertedAt = reading.Time;
                _excused = TimeSpan.Zero;
                _state = SettleState.Bouncing;
                goto case SettleState.Bouncing;
            case SettleState.Bouncing:
                if (reading.Time - _insertedAt!.Value < _options.BounceIgnore)
                {
                    return Verdict(SettleState.Bouncing, reading);
                }

                _state = SettleState.Settling;
                return Settle(reading, overload);
            case SettleState.Settling:
                return Settle(reading, overload);
            default:
                return AwaitRemoval(reading, overload);
        }
    }

    /// <summary>Operator action: discard the readings and settle again with the part still in (no bounce).
    /// Does nothing when the fixture is empty.</summary>
    public void Remeasure()
    {
        if (_state == SettleState.Empty)
        {
            return;
        }

        ClearPart();
        _state = SettleState.Settling;
        _restartOnNextReading = true;
    }

    /// <summary>
    /// The readings of the part in the fixture stopped for <paramref name="gap"/> (a link fault, a host that
    /// was not scheduled): that time does not count against <see cref="SettleOptions.MaxSettleTime"/>, which
    /// gives up on parts that do not settle, not on readings that did not come. Ignored unless a part is
    /// bouncing or settling. The readings either side stay in the window: the part kept settling meanwhile.
    /// </summary>
    /// <param name="gap">Time without readings to leave out, &gt;= 0.</param>
    public void Excuse(TimeSpan gap)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(gap, TimeSpan.Zero);
        if (_state is SettleState.Bouncing or SettleState.Settling)
        {
            _excused += gap;
        }
    }

    /// <summary>Operator action: forget everything and wait for an insertion.</summary>
    public void Reset()
    {
        ClearPart();
        _state = SettleState.Empty;
        _insertedAt = null;
        _lastTime = null;
    }

    /// <summary>
    /// Feeds readings until a verdict (Accepted or Unstable) or the end of the sequence. For benchmarks and replays.
    /// </summary>
    public static SettleRun Run(
        IEnumerable<Reading> readings,
        RangeSpec range,
        NplcSpec nplc,
        SettleOptions? options = null
    )
    {
        ArgumentNullException.ThrowIfNull(readings);
        var tracker = new SettleTracker(range, nplc, options);
        SettleVerdict? last = null;
        var used = 0;
        foreach (var reading in readings)
        {
            used++;
            last = tracker.Add(reading);
            if (last.State is SettleState.Accepted or SettleState.Unstable)
            {
                break;
            }
        }

        return new SettleRun(last ?? tracker.Verdict(SettleState.Empty, default), used);
    }
}
