using SortRig.Engine.Composition;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Ranging;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// The settle target SortPlan chooses on the simulator profile (instruments/simulator.yaml: 100 k range at 1 NPLC,
/// noise 0.7 ppm and step 1 ppm of range, 24 readings/s; 10 k range likewise): small against the match band, reachable
/// on the locked range and NPLC, or refused up front with remedies. Expected figures are derived by hand from the
/// profile.
/// </summary>
public sealed class SortPlanTargetTests
{
    private static readonly MeterSpec s_meter = ProfileLocator.Load("simulator").Spec;

    [Fact]
    public void Plan_DefaultJob_TargetUnchangedAt5Ppm()
    {
        var plan = SortPlan.For(new SortOptions(), s_meter);

        // The rule before this change: clamp(1000 ppm / 200, 0.5, 10) = 5 ppm (docs/bench-settle.md's cases).
        Assert.Equal((10_000.0, 1.0), (plan.Range, plan.Nplc));
        Assert.Equal(SettleTarget.Ppm(5), plan.Settle.Target);
        Assert.Equal(TimeSpan.FromSeconds(4), plan.Settle.SettlingSpan);
    }

    [Fact]
    public void Plan_20kAt005Percent_TargetAboveWhatTheWindowCanReach()
    {
        var plan = SortPlan.For(new SortOptions { Nominal = 20_000, MatchTolerance = 0.0005 }, s_meter);

        // By hand: one reading on the 100 k range at 1 NPLC scatters sqrt(0.07² + 0.1²/12) = 0.0757 Ohm = 3.79 ppm of
        // 20 kOhm (quantisation as step/sqrt(12), GUM F.2.2.1); the mean of 8 readings 1.34 ppm. The 4 s settling span
        // leaves a slope floor of 0.0633 Ohm = 3.16 ppm (worked out in SortRig.Measurement.Tests' SettleReachTests for
        // the same range figures). The old target, 500 ppm / 200 = 2.5 ppm, lies below twice that floor (6.33 ppm).
        var reach = SettleReach.Predict(plan.Decision.Range, plan.Decision.Nplc, plan.Settle);
        Assert.Equal(0.0757, reach.ReadingSigma, 4);
        Assert.Equal(0.0757 / Math.Sqrt(8), reach.Sem, 4);
        Assert.Equal(0.0633, reach.Floor, 4);
        Assert.True(
            plan.Settle.Target.Value >= 2 * reach.Floor / 20_000 * 1e6,
            $"target {plan.Settle.Target.Value} ppm"
        );

        // Still small against the band: at most the range rule's allowed expanded uncertainty (125 ppm) over 2
        // sqrt(4/3).
        Assert.InRange(plan.Settle.Target.Value, 2.5, 125 / (2 * Math.Sqrt(4.0 / 3)));
    }

    [Fact]
    public void Plan_20kAt0005Percent_RangeResolvesButSettleCannot_RefusedWithRemedies()
    {
        var options = new SortOptions { Nominal = 20_000, MatchTolerance = 0.00005 };

        // The range rule alone accepts the 100 k range, 2-wire at 1 NPLC: 0.05/√3, 0.07/√8, 0.1 × (0.6 + 0.4)/√3 and
        // the 0.1 Ohm lead term /√3 give u = 0.0901 Ohm, expanded 0.180 Ohm = 9.0 ppm of 12.5 ppm allowed (0.25 × 50
        // ppm) ...
        var decision = RangeRule.Choose(s_meter, new RangeRequest(20_000, 0.01, 0.00005, 1, false));
        Assert.Equal(RangeVerdict.Resolvable, decision.Verdict);
        Assert.Equal(9.0, decision.ExpandedTransfer / 20_000 * 1e6, 1);

        // ... but a target under sqrt(12.5² − 9.0²) / (2 sqrt(4/3)) = 3.75 ppm is below twice what a settled part
        // reaches (2 × 3.16 = 6.33 ppm).
        var e = Assert.Throws<SortPlanException>(() => SortPlan.For(options, s_meter));
        Assert.Contains("unstable", e.Message, StringComparison.Ordinal);
        Assert.Contains(e.Remedies, r => r.Contains("--match", StringComparison.Ordinal));

        // The loosened match named is one the plan then takes.
        var match = double.Parse(
            e.Remedies.Single(r => r.Contains("--match", StringComparison.Ordinal)).Split("--match ")[1].TrimEnd(')'),
            System.Globalization.CultureInfo.InvariantCulture
        );
        Assert.True(match > 0.00005);
        _ = SortPlan.For(new SortOptions { Nominal = 20_000, MatchTolerance = match }, s_meter);
    }
}
