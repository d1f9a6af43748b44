using System.Globalization;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle-limits`' second line per case: the fit limit under the bench's own reading noise
/// (<see cref="FitLimit.RunUnder"/>: white plus the rich physics' 1/f-like excess noise), and the floor of a rule that
/// keeps issue #13's fallback. A popcorn part that flips before the fit limit's reading must fall back to the averaging
/// rule, which cannot stop before the averaging limit; one that has not flipped by then stops at the earlier of the two
/// limits. The first flip comes after an exponential dwell (the simulator draws it at insertion), so per part the floor
/// is either + share × (1 − exp(−T / dwell)) × (averaging − either), T the fit limit's time. Both limits read no
/// reading; the averaging limit is the white one (the lower), so the floor stays a floor.
/// </summary>
internal sealed class BenchNoiseColumns
{
    private readonly List<double> _fit = [];
    private readonly List<double> _prior = [];
    private readonly List<double> _either = [];
    private readonly List<double> _floor = [];
    private readonly List<double> _whiteFloor = [];

    /// <summary>Adds one part: its averaging limit, the fit limits under the bench's noise (free, and with the body
    /// prior from the rule's least record), the white fit limit with that prior and record and its either-limit, and
    /// the popcorn figures.</summary>
    public void Add(
        RuleOutcome averaging,
        RuleOutcome fit,
        RuleOutcome prior,
        double whiteEither,
        double whitePrior,
        double popcornShare,
        TimeSpan dwell
    )
    {
        _fit.Add(fit.Seconds);
        _prior.Add(prior.Seconds);
        var either = Math.Min(averaging.Seconds, prior.Seconds);
        _either.Add(either);
        _floor.Add(either + Fallback(averaging.Seconds, either, prior.Seconds, popcornShare, dwell));
        _whiteFloor.Add(whiteEither + Fallback(averaging.Seconds, whiteEither, whitePrior, popcornShare, dwell));
    }

    /// <summary>The case's line; ratios are to the mean averaging limit <paramref name="limit"/>.</summary>
    public string Line(string name, double limit)
    {
        string Cell(List<double> v) =>
            string.Create(CultureInfo.InvariantCulture, $"{v.Average():0.00} s ({v.Average() / limit:0.000} ×)");
        return $"{name}, under the bench's own noise: fit limit {Cell(_fit)}; with body prior from reading "
            + $"{PredictiveReadings} {Cell(_prior)}, or the averaging limit if earlier {Cell(_either)}; floor with "
            + $"popcorn falling back {Cell(_floor)} (white noise: {Cell(_whiteFloor)})";
    }

    private static int PredictiveReadings => SortRig.Measurement.Settling.PredictiveOptions.Default.MinReadings;

    private static double Fallback(double averaging, double either, double fitTime, double share, TimeSpan dwell) =>
        share * (1 - Math.Exp(-fitTime / dwell.TotalSeconds)) * Math.Max(averaging - either, 0);
}
