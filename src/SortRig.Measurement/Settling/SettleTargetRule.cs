using System.Globalization;
using SortRig.Measurement.Ranging;
using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Settling;

/// <summary>
/// The settle target of a batch (standard error of the window mean, and bound on the residual settling), ppm of
/// the value: small against the match band, yet reachable on the locked range and NPLC. See docs/measurement.md,
/// "Settle target".
/// </summary>
/// <param name="TargetPpm">The target chosen, ppm of value.</param>
/// <param name="BasePpm">clamp(match ppm / 200, 0.5, 10): negligible in the match budget.</param>
/// <param name="FloorPpm">The settle rule's predicted floor on this range and NPLC (<see cref="SettleReach.Floor"/>),
/// ppm of nominal.</param>
/// <param name="CapPpm">Largest target that keeps the range rule's verdict with the settle terms at their limit, ppm of
/// nominal.</param>
/// <param name="WindowFits">The window's readings take at most half of MaxSettleTime at the spec'd rate (the other half
/// is left for the part to cool: an engineering assumption).</param>
public sealed record SettleTargetRule(double TargetPpm, double BasePpm, double FloorPpm, double CapPpm, bool WindowFits)
{
    /// <summary>The target must be at least this many times the predicted floor, so a settled part passes on most
    /// windows.</summary>
    public const double ReachMargin = 2;

    /// <summary>A target at the cap adds SEM ≤ T (normal) and a residual ≤ T (rectangular, T/√3): √(1 + 1/3) T
    /// standard.</summary>
    private static readonly double s_settleTermsPerTarget = Math.Sqrt(1 + (1.0 / 3));

    /// <summary>True when the floor with its margin fits under the cap.</summary>
    public bool Reachable => WindowFits && ReachMargin * FloorPpm <= CapPpm;

    public static SettleTargetRule For(RangeDecision decision, SettleOptions settle)
    {
        var nominal = decision.Request.Nominal;
        var basePpm = Math.Clamp(decision.Request.MatchTolerance * 1e6 / 200, 0.5, 10);
        var floorPpm = SettleReach.Predict(decision.Range, decision.Nplc, settle).Floor / nominal * 1e6;
        var k = decision.ExpandedTransfer / decision.TransferUncertainty;
        var headroom = Math.Sqrt(
            Math.Max(
                0,
                (decision.AllowedExpanded * decision.AllowedExpanded)
                    - (decision.ExpandedTransfer * decision.ExpandedTransfer)
            )
        );
        var capPpm = headroom / (k * s_settleTermsPerTarget) / nominal * 1e6;
        var fits = settle.RequiredReadings / decision.Nplc.ReadingsPerSecond <= settle.MaxSettleTime.TotalSeconds / 2;
        return new SettleTargetRule(Math.Max(basePpm, ReachMargin * floorPpm), basePpm, floorPpm, capPpm, fits);
    }

    /// <summary>The smallest match tolerance (fraction) whose cap holds this floor with its margin.</summary>
    public double MatchThatFits(RangeDecision decision)
    {
        var k = decision.ExpandedTransfer / decision.TransferUncertainty;
        var needed = ReachMargin * FloorPpm * 1e-6 * decision.Request.Nominal * k * s_settleTermsPerTarget;
        var allowedPerMatch = decision.AllowedExpanded / decision.Request.MatchTolerance;
        var match =
            Math.Sqrt((decision.ExpandedTransfer * decision.ExpandedTransfer) + (needed * needed)) / allowedPerMatch;
        var digits = Math.Pow(10, Math.Floor(Math.Log10(match)) - 2);
        return Math.Ceiling(match / digits) * digits;
    }

    /// <summary>Remedies when the target is out of reach: NPLC settings of the meter where it is reachable, a looser
    /// match.</summary>
    public static List<string> Remedies(
        MeterSpec meter,
        RangeDecision decision,
        SettleOptions settle,
        SettleTargetRule rule
    )
    {
        var remedies = new List<string>();
        foreach (var nplc in meter.Nplcs.Where(p => Math.Abs(p.Nplc - decision.Nplc.Nplc) > 1e-9).OrderBy(p => p.Nplc))
        {
            var other = RangeRule.Choose(meter, decision.Request with { Nplc = nplc.Nplc });
            if (other.Verdict == RangeVerdict.Resolvable && For(other, settle).Reachable)
            {
                remedies.Add(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"set the integration time to {nplc.Nplc:G} NPLC (--nplc {nplc.Nplc:G})"
                    )
                );
            }
        }

        var match = rule.MatchThatFits(decision);
        remedies.Add(
            string.Create(
                CultureInfo.InvariantCulture,
                $"loosen the match to {match * 100:0.####} % (--match {match:G4})"
            )
        );
        return remedies;
    }
}
