using SortRig.Measurement.Settling;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

public sealed class PredictiveSettlingTests
{
    private const double TargetPpm = 5;
    private const double R = ReadingScript.Range;

    private static SettleOptions Averaging =>
        SettleOptions.Default with
        {
            Target = SettleTarget.Ppm(TargetPpm),
            MaxSettleTime = TimeSpan.FromSeconds(40),
            SettlingSpan = TimeSpan.FromSeconds(4),
        };

    private static SettleOptions Predictive => Averaging with { Predictive = PredictiveOptions.Default };

    /// <summary>A warm 10 kOhm part: 60 ppm excess decaying with 4 s, 0.5 ppm noise, a reading every 41 ms.</summary>
    private static List<SortRig.Measurement.Readings.Reading> Recovery(int seed, Func<double, double>? extra = null)
    {
        var noise = Gaussian(seed, 0.005);
        return
        [
            .. Sampled(0, 0.041, 1200, t => R * (1 + (60e-6 * Math.Exp(-t / 4))) + noise() + (extra?.Invoke(t) ?? 0)),
        ];
    }

    private static SettleAcceptance Accept(
        SettleOptions options,
        IEnumerable<SortRig.Measurement.Readings.Reading> readings
    ) => Tracker(options).Feed(readings).Single(v => v.State == SettleState.Accepted).Acceptance!;

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Exponential_PredictsTheFinalValueBeforeTheAveragingRuleCan(int seed)
    {
        var readings = Recovery(seed);

        var predicted = Accept(Predictive, readings);
        var averaged = Accept(Averaging, readings);

        Assert.Equal(SettleRule.Predictive, predicted.AcceptedBy);
        Assert.NotNull(predicted.Fit);
        Assert.True(
            predicted.TimeToSettle < averaged.TimeToSettle / 2,
            $"{predicted.TimeToSettle} vs {averaged.TimeToSettle}"
        );
        Assert.InRange(predicted.Value.Value, R * (1 - (2 * TargetPpm * 1e-6)), R * (1 + (2 * TargetPpm * 1e-6)));
        Assert.True(predicted.Fit!.StandardUncertainty <= TargetPpm * 1e-6 * R);
        Assert.Equal(SettleRule.Averaging, averaged.AcceptedBy);
    }

    [Theory]
    [InlineData(1, 1.2)]
    [InlineData(2, 1.8)]
    [InlineData(3, 2.5)]
    public void PopcornStepMidSettle_FallsBackToTheAveragingRule_NotAcceptedEarly(int seed, double stepAt)
    {
        // A burst-noise step of +8 ppm while the part is still cooling: the recovery is no longer an exponential.
        var readings = Recovery(seed, t => t >= stepAt ? 8e-6 * R : 0);

        var withPrediction = Accept(Predictive, readings);
        var averagingOnly = Accept(Averaging, readings);

        Assert.Equal(SettleRule.Averaging, withPrediction.AcceptedBy);
        Assert.Equal(averagingOnly.TimeToSettle, withPrediction.TimeToSettle);
        Assert.InRange(
            withPrediction.Value.Value - (R * (1 + 8e-6)),
            -2 * TargetPpm * 1e-6 * R,
            2 * TargetPpm * 1e-6 * R
        );
    }

    [Theory]
    [InlineData(5)]
    [InlineData(6)]
    public void BodyFasterThanHalfTheAssumedConstant_IsNotBelievedEarly(int seed)
    {
        // The body prior (common practice, no source): a fitted slow path below half of AssumedTimeConstant must
        // agree with a fit whose slow path is held at that floor before the fit may accept. A part cooling with
        // 1.2 s is accepted sooner when the sort assumes 2 s (floor 1 s: the fit is believed) than when it assumes
        // 5 s (floor 2.5 s: the record must first rule the slow body out).
        var noise = Gaussian(seed, 0.005);
        var readings = Sampled(0, 0.041, 1200, t => R * (1 + (60e-6 * Math.Exp(-t / 1.2))) + noise()).ToList();

        var believed = Accept(Predictive with { AssumedTimeConstant = TimeSpan.FromSeconds(2) }, readings);
        var doubted = Accept(Predictive with { AssumedTimeConstant = TimeSpan.FromSeconds(5) }, readings);

        Assert.Equal(SettleRule.Predictive, believed.AcceptedBy);
        Assert.True(
            doubted.TimeToSettle > believed.TimeToSettle + TimeSpan.FromSeconds(0.5),
            $"{doubted.TimeToSettle} vs {believed.TimeToSettle}"
        );
        Assert.InRange(doubted.Value.Value, R * (1 - (2 * TargetPpm * 1e-6)), R * (1 + (2 * TargetPpm * 1e-6)));
    }

    [Fact]
    public void Flicker_ClearsTheFit()
    {
        var readings = Recovery(4).Take(40).ToList();
        readings.Add(OverloadAt(40 * 0.041));
        readings.AddRange(Sampled(41 * 0.041, 0.041, 10, _ => R));
        var tracker = Tracker(Predictive);

        var verdicts = tracker.Feed(readings);

        // Ten readings after the flicker are fewer than the predictive rule's 12: nothing can be accepted yet.
        Assert.DoesNotContain(verdicts, v => v.State == SettleState.Accepted);
    }

    [Fact]
    public void PredictiveOptions_InvalidValue_NamesIt()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => PredictiveOptions.Default with { MinReadings = 3 });
        Assert.Equal("MinReadings", e.ParamName);
    }
}
