using System.Globalization;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle-diag [parts] [case] [seed] losses`: where the predictive rule loses time against the either limit (per part
/// the earlier of the averaging and fit oracles): seconds a part over the reel, by which rule accepted, in the first
/// 300 parts, under the reel-learned range; and the rule against the fit limit by the part's excess (tempco × handling
/// warmth), there also the earlier of the averaging limit and the fit limit under the bench's own noise with the body
/// prior from the rule's least record (<see cref="FitLimit.RunUnder"/>). The averaging oracle reads the noise-free
/// values further than the rule did, which draws readings: the noise of later parts differs from a run without it
/// (counts compare, parts do not).
/// </summary>
internal sealed class LossLedger
{
    private static readonly double[] s_edges = [0, 10, 20, 40, 80, 160, double.PositiveInfinity];
    private readonly List<Row> _rows = [];

    public void Add(
        int index,
        double seconds,
        bool predicted,
        bool underPrior,
        double excessPpm,
        RuleOutcome fit,
        RuleOutcome averaging,
        RuleOutcome priorFit
    ) =>
        _rows.Add(
            new Row(
                index,
                seconds,
                predicted,
                underPrior,
                excessPpm,
                fit.Seconds,
                FitLimit.Earlier(averaging, fit).Seconds,
                FitLimit.Earlier(averaging, priorFit).Seconds
            )
        );

    public void Print()
    {
        var n = _rows.Count;
        if (n == 0)
        {
            return;
        }

        double Loss(Func<Row, bool> which) => _rows.Where(which).Sum(r => r.Seconds - r.Either) / n;
        Console.WriteLine(
            string.Create(
                CultureInfo.InvariantCulture,
                $"rule {_rows.Average(r => r.Seconds):0.00} s, fit limit {_rows.Average(r => r.Fit):0.00} s, either "
                    + $"limit "
                    + $"{_rows.Average(r => r.Either):0.00} s; lost a part against the either limit: by prediction "
                    + $"{Loss(r => r.Predicted):0.00} s, by the fallback {Loss(r => !r.Predicted):0.00} s, in the "
                    + $"first "
                    + $"300 parts {Loss(r => r.Index < 300):0.00} s, under the learned range "
                    + $"{Loss(r => r.UnderPrior):0.00} s"
            )
        );
        for (var b = 0; b + 1 < s_edges.Length; b++)
        {
            var (lo, hi) = (s_edges[b], s_edges[b + 1]);
            var bin = _rows.Where(r => Math.Abs(r.Excess) >= lo && Math.Abs(r.Excess) < hi).ToList();
            if (bin.Count > 0)
            {
                Console.WriteLine(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"  excess {lo:0}-{hi:0} ppm: {bin.Count} parts, rule {bin.Average(r => r.Seconds):0.00} s "
                            + $"({100.0 * bin.Count(r => r.Predicted) / bin.Count:0} % by prediction), fit limit "
                            + $"{bin.Average(r => r.Fit):0.00} s, either limit {bin.Average(r => r.Either):0.00} s, "
                            + $"under the bench's noise with the body prior {bin.Average(r => r.Floor):0.00} s"
                    )
                );
            }
        }
    }

    /// <summary>One accepted part: its index and seconds, how it was accepted, its excess (ppm) and the oracles'
    /// times (the fit limit, the either limit, the either limit under the bench's noise with the body prior).</summary>
    private readonly record struct Row(
        int Index,
        double Seconds,
        bool Predicted,
        bool UnderPrior,
        double Excess,
        double Fit,
        double Either,
        double Floor
    );
}
