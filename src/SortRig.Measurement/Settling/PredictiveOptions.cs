namespace SortRig.Measurement.Settling;

/// <summary>
/// Options of the predictive settle rule (see docs/measurement.md, "Predictive rule"). Each property is validated
/// when set. The defaults are engineering choices for parts handled by hand and cooling in seconds, not tuned to a
/// test. The longest time constant a fit may use is <see cref="SettleOptions.AssumedTimeConstant"/> (the assumed upper
/// bound of a handled part's thermal time constant): a fit that wants a longer one sees no recovery it can bound.
/// </summary>
public sealed record PredictiveOptions
{
    private readonly TimeSpan _fitInterval = TimeSpan.FromSeconds(0.25);
    private readonly TimeSpan _fitSpan = TimeSpan.FromSeconds(20);
    private readonly int _minReadings = 10;
    private readonly TimeSpan _minSpan = TimeSpan.FromSeconds(1);
    private readonly double _misfitFraction = 0.1;
    private readonly double _whitenessAlpha = 0.01;
    private readonly int _teachingFailures;

    /// <summary>The default options (no hold to teach the reel: <see cref="TeachingFailures"/> 0).</summary>
    public static PredictiveOptions Default { get; } = new();

    /// <summary>The <see cref="TeachingFailures"/> a long reel is sorted with (the sort's and the
    /// benchmark's).</summary>
    public const int ReelTeachingFailures = 15;

    /// <summary>Least time between two fits (the fit is the costly part). Default 0.25 s; valid [0, 60 s]; 0 fits on
    /// every reading.</summary>
    public TimeSpan FitInterval
    {
        get => _fitInterval;
        init => _fitInterval = InRange(value, TimeSpan.Zero, TimeSpan.FromSeconds(60), nameof(FitInterval));
    }

    /// <summary>Readings older than this (before the newest) are left out of the fit. Default 20 s; valid [1 s, 10
    /// min].</summary>
    public TimeSpan FitSpan
    {
        get => _fitSpan;
        init => _fitSpan = InRange(value, TimeSpan.FromSeconds(1), TimeSpan.FromMinutes(10), nameof(FitSpan));
    }

    /// <summary>
    /// Finite readings after the bounce before a fit may accept. Default 10: the least record on which the runs test
    /// of the residuals (<see cref="WhitenessAlpha"/>, 1 %) can reject at all, since the fewest runs, 2, have
    /// probability 2 / C(n, n/2) under white residuals (exact distribution, Wald and Wolfowitz 1940, from memory):
    /// 2 / 252 = 0.8 % at 10, 2 / 126 = 1.6 % at 9; it is also the least record on which the rule fits two
    /// exponentials (five parameters, five degrees of freedom left). Twelve (until the twelfth pass) was a floor of
    /// 4.4-4.8 s at NPLC 10. The least span (<see cref="MinSpan"/>) binds at fast reading rates. Valid [6, 100 000]
    /// (two exponentials have 5 parameters).
    /// </summary>
    public int MinReadings
    {
        get => _minReadings;
        init => _minReadings = InRange(value, 6, 100_000, nameof(MinReadings));
    }

    /// <summary>Least time covered by the fitted readings before a fit may accept. Default 1 s; valid [0, 10
    /// min].</summary>
    public TimeSpan MinSpan
    {
        get => _minSpan;
        init => _minSpan = InRange(value, TimeSpan.Zero, TimeSpan.FromMinutes(10), nameof(MinSpan));
    }

    /// <summary>
    /// Model-misfit allowance: the part of the recovery still to come at the newest reading (fitted value there
    /// minus predicted final value) is trusted to this fraction, a rectangular half-width, because no model of a real
    /// part's cooling is exact. Default 0.1; valid [0, 1].
    /// </summary>
    public double MisfitFraction
    {
        get => _misfitFraction;
        init =>
            _misfitFraction = value is >= 0 and <= 1
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(MisfitFraction),
                    value,
                    "MisfitFraction must be in [0, 1]."
                );
    }

    /// <summary>One-sided significance of the runs test on the residuals (too few runs: not noise). Default 0.01; valid
    /// (0, 0.5].</summary>
    public double WhitenessAlpha
    {
        get => _whitenessAlpha;
        init =>
            _whitenessAlpha = value is > 0 and <= 0.5
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(WhitenessAlpha),
                    value,
                    "WhitenessAlpha must be in (0, 0.5]."
                );
    }

    /// <summary>
    /// How long the first parts of a session are held to teach the reel's prior (<see cref="ReelPrior"/>): while
    /// fewer than <see cref="ReelPrior.MinParts"/> parts have resolved their body and fewer than this many accepted
    /// parts have not, a fit does not accept before its record covers twice the assumed longest time constant, the
    /// record on which a body resolves. Without the hold the reel learns only from parts that happen to wait that
    /// long, which a fast rule leaves few of: on the simple bench at NPLC 10 the prior came after part 2 251 of 3 000
    /// (settle-diag 3000 1 5127) and the rule took 5.64 s a part; held, the prior came at part 27 and the rule took
    /// 5.32 s (5.23 s under the reel's true prior from the first part). The count of parts that did not resolve ends
    /// the hold on a reel whose records seldom resolve in that time (two thermal paths and slow noise: on the rich
    /// bench 32 parts of 391 resolved, and holding 40 parts taught nothing, settle-diag 3000 6 5133): with 20 parts
    /// to learn and a share p resolving, the parts that do not resolve first number 20 (1 − p) / p on average, about
    /// 7 ± 3 on the simple bench (p about 3/4), so 15 rarely ends a hold that teaches and ends one that does not
    /// after about 15 parts (<see cref="ReelTeachingFailures"/>). The hold costs a few seconds on each held part and
    /// pays on a long reel only: the sort holds for a session of 400 parts or more, or of unknown length. Default 0
    /// (none held); valid [0, 100 000].
    /// </summary>
    public int TeachingFailures
    {
        get => _teachingFailures;
        init => _teachingFailures = InRange(value, 0, 100_000, nameof(TeachingFailures));
    }

    private static int InRange(int value, int min, int max, string name) =>
        value >= min && value <= max
            ? value
            : throw new ArgumentOutOfRangeException(name, value, $"{name} must be in [{min}, {max}].");

    private static TimeSpan InRange(TimeSpan value, TimeSpan min, TimeSpan max, string name) =>
        value >= min && value <= max
            ? value
            : throw new ArgumentOutOfRangeException(
                name,
                value,
                $"{name} must be in [{min.TotalSeconds:G4} s, {max.TotalSeconds:G4} s]."
            );
}
