using MathNet.Numerics.Statistics;
using SortRig.Measurement.Settling;

namespace SortRig.Bench.Settling;

/// <summary>Figures of one rule over a reel. Quantiles are MathNet's default (R-8, approximately
/// median-unbiased).</summary>
internal sealed record RuleSummary(
    string Rule,
    int Parts,
    int Accepted,
    Spread Seconds,
    Spread Readings,
    int FalseAcceptsU,
    int FalseAcceptsTarget,
    double MedianAbsErrorPpm,
    double P99AbsErrorPpm,
    double MaxAbsErrorPpm,
    double MedianUPpm,
    int Predicted
)
{
    public int Unstable => Parts - Accepted;

    public double RateU => Accepted > 0 ? (double)FalseAcceptsU / Accepted : double.NaN;

    public double RateTarget => Accepted > 0 ? (double)FalseAcceptsTarget / Accepted : double.NaN;

    public double UpperU => ClopperPearson.Upper(FalseAcceptsU, Accepted);

    public double UpperTarget => ClopperPearson.Upper(FalseAcceptsTarget, Accepted);

    /// <summary>Settle-limited throughput: 3600 / mean seconds per part (handling time not included).</summary>
    public double PartsPerHour => 3600 / Seconds.Mean;

    public bool Measures => Accepted > 0 && !double.IsNaN(MedianAbsErrorPpm);

    /// <summary>Summarises outcomes; a false accept is an accepted value whose |error| exceeds its stated U, or 2 ×
    /// target.</summary>
    public static RuleSummary Of(string rule, IReadOnlyList<RuleOutcome> outcomes, double targetPpm)
    {
        var accepted = outcomes.Where(o => o.Accepted).ToList();
        var measured = accepted.Where(o => !double.IsNaN(o.ErrorPpm)).ToList();
        var abs = measured.Select(o => Math.Abs(o.ErrorPpm)).ToArray();
        var faU = measured.Count(o => Math.Abs(o.ErrorPpm) > o.ExpandedTransferPpm);
        var faT = measured.Count(o => Math.Abs(o.ErrorPpm) > 2 * targetPpm);
        return new RuleSummary(
            rule,
            outcomes.Count,
            accepted.Count,
            Spread.Of(outcomes.Select(o => o.Seconds)),
            Spread.Of(outcomes.Select(o => (double)o.Readings)),
            faU,
            faT,
            abs.Length > 0 ? abs.Median() : double.NaN,
            abs.Length > 0 ? abs.Quantile(0.99) : double.NaN,
            abs.Length > 0 ? abs.Max() : double.NaN,
            measured.Count > 0 ? measured.Select(o => o.ExpandedTransferPpm).Median() : double.NaN,
            accepted.Count(o => o.Predicted)
        );
    }
}

/// <summary>Mean, median and 95th percentile.</summary>
internal readonly record struct Spread(double Mean, double Median, double P95)
{
    public static Spread Of(IEnumerable<double> values)
    {
        var x = values.ToArray();
        return x.Length == 0 ? new(double.NaN, double.NaN, double.NaN) : new(x.Mean(), x.Median(), x.Quantile(0.95));
    }
}
