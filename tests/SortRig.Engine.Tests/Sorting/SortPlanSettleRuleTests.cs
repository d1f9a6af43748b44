using SortRig.Engine.Composition;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>
/// The settle rule the sort's plan hands the loop (--settle): the predictive rule beside the averaging rule by default
/// (docs/bench-settle.md, tenth pass: the rule holds the false-accept bound pooled over many reels), the averaging rule
/// alone when asked, and the same settle target either way (the target is the match band's, not the rule's).
/// </summary>
public sealed class SortPlanSettleRuleTests
{
    private static readonly MeterSpec s_meter = ProfileLocator.Load("simulator").Spec;

    private static readonly PredictiveOptions s_reel = PredictiveOptions.Default with
    {
        TeachingFailures = PredictiveOptions.ReelTeachingFailures,
    };

    [Fact]
    public void Plan_Default_PredictiveRuleBesideAveraging()
    {
        var plan = SortPlan.For(new SortOptions(), s_meter);

        Assert.Equal(SettleRule.Predictive, plan.Options.Settle);
        Assert.Equal(s_reel, plan.Settle.Predictive); // a session of unknown length: a reel
    }

    [Fact]
    public void Plan_Averaging_AveragingRuleOnly()
    {
        var plan = SortPlan.For(new SortOptions { Settle = SettleRule.Averaging }, s_meter);

        Assert.Null(plan.Settle.Predictive);
    }

    [Fact]
    public void Plan_Predictive_PredictiveRuleBesideAveraging_SameTarget()
    {
        var averaging = SortPlan.For(new SortOptions { Settle = SettleRule.Averaging }, s_meter);
        var predictive = SortPlan.For(new SortOptions { Settle = SettleRule.Predictive }, s_meter);

        Assert.Equal(s_reel, predictive.Settle.Predictive);
        Assert.Equal(averaging.Settle with { Predictive = s_reel }, predictive.Settle);
    }

    [Theory]
    [InlineData(0, PredictiveOptions.ReelTeachingFailures)] // until the operator finishes: a reel of unknown length
    [InlineData(40, 0)] // the demo: the hold could not pay back
    [InlineData(SortPlan.TeachingLeastParts - 1, 0)]
    [InlineData(SortPlan.TeachingLeastParts, PredictiveOptions.ReelTeachingFailures)]
    [InlineData(3000, PredictiveOptions.ReelTeachingFailures)]
    public void Plan_Predictive_HoldsFirstPartsToTeachTheReel_OnlyOnALongSession(int parts, int failures)
    {
        var plan = SortPlan.For(new SortOptions { Parts = parts }, s_meter);

        Assert.Equal(PredictiveOptions.Default with { TeachingFailures = failures }, plan.Settle.Predictive);
        // A part settled on its own tracker (the check, a part measured again, a bridging part) teaches no reel.
        Assert.Equal(plan.Settle with { Predictive = PredictiveOptions.Default }, plan.SettleOnePart);
    }
}
