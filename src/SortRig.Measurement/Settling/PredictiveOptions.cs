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

    /// <summary>The default options.</summary>
    public static PredictiveOptions Default { get; } = new();

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
        init =>
            _minReadings = value is >= 6 and <= 100_000
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(MinReadings),
                    value,
                    "MinReadings must be in [6, 100000]."
                );
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

    private static TimeSpan InRange(TimeSpan value, TimeSpan min, TimeSpan max, string name) =>
        value >= min && value <= max
            ? value
            : throw new ArgumentOutOfRangeException(
                name,
                value,
                $"{name} must be in [{min.TotalSeconds:G4} s, {max.TotalSeconds:G4} s]."
            );
}
