using FsCheck.Xunit;
using SortRig.Measurement.Settling;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>
/// Properties of the settle rule over generated reading scripts (FsCheck). Target 10 ppm of 10 kOhm = 0.1 Ohm,
/// slope fraction 0.5, window 8 unless the case says otherwise.
/// </summary>
public sealed class SettleTrackerProperties
{
    private const double T = SettleArbitraries.TargetOhms;
    private static readonly TimeSpan s_bounce = SettleOptions.Default.BounceIgnore;

    [Property(Arbitrary = [typeof(SettleArbitraries)])]
    public void NeverAcceptsBeforeMinReadings(ScriptCase c)
    {
        var options = new SettleOptions { WindowLength = c.WindowLength, MinReadings = c.MinReadings };
        var tracker = new SettleTracker(InventedMeter.R10k, InventedMeter.One, options);
        DateTimeOffset? insertion = null;
        var counted = 0;
        foreach (var reading in c.Readings())
        {
            var verdict = tracker.Add(reading);
            if (reading.IsFinite)
            {
                insertion ??= reading.Time;
                counted += reading.Time - insertion.Value >= s_bounce ? 1 : 0;
            }

            if (verdict.State == SettleState.Accepted)
            {
                Assert.True(
                    counted >= Math.Max(c.MinReadings, c.WindowLength),
                    $"accepted after {counted} counted readings"
                );
                Assert.Equal(c.WindowLength, verdict.Acceptance!.Readings.Count);
                Assert.All(verdict.Acceptance.Readings, r =>
                    Assert.True(r.IsFinite && r.Time - insertion!.Value >= s_bounce)
                );
            }

            if (verdict.State == SettleState.Removed)
            {
                insertion = null;
                counted = 0;
            }
        }
    }

    [Property(Arbitrary = [typeof(SettleArbitraries)])]
    public void NeverAcceptsTwiceWithoutRemoval(ScriptCase c)
    {
        var tracker = new SettleTracker(
            InventedMeter.R10k,
            InventedMeter.One,
            new SettleOptions { WindowLength = c.WindowLength, MinReadings = c.MinReadings }
        );
        var acceptedSinceRemoval = false;
        foreach (var verdict in tracker.Feed(c.Readings()))
        {
            if (verdict.State == SettleState.Accepted)
            {
                Assert.False(acceptedSinceRemoval, "accepted twice without a removal");
                acceptedSinceRemoval = true;
            }

            acceptedSinceRemoval &= verdict.State != SettleState.Removed;
        }
    }

    [Property(Arbitrary = [typeof(SettleArbitraries)])]
    public void RemovalAlwaysReturnsToEmpty(ScriptCase c)
    {
        var tracker = new SettleTracker(
            InventedMeter.R10k,
            InventedMeter.One,
            new SettleOptions { WindowLength = c.WindowLength, MinReadings = c.MinReadings }
        );
        var last = Start;
        foreach (var reading in c.Readings())
        {
            last = reading.Time;
            if (tracker.Add(reading).State == SettleState.Removed)
            {
                Assert.Equal(SettleState.Empty, tracker.State);
            }
        }

        // Pull the part: two overloads, each past the bounce time, end in Empty from any state.
        tracker.Add(SortRig.Measurement.Readings.Reading.Overload(last.AddMilliseconds(60), ReadingScript.Range));
        tracker.Add(SortRig.Measurement.Readings.Reading.Overload(last.AddMilliseconds(120), ReadingScript.Range));
        Assert.Equal(SettleState.Empty, tracker.State);
    }

    [Property(Arbitrary = [typeof(SettleArbitraries)])]
    public void ExponentialSettling_AcceptedOnlyWhenExcessIsWithinTarget(ExponentialCase c)
    {
        var run = SettleTracker.Run(c.Readings(25), InventedMeter.R10k, InventedMeter.One);
        if (run.Final.Acceptance is { } a)
        {
            var acceptedAt = (a.Readings[^1].Time - Start).TotalSeconds;
            Assert.True(
                Math.Abs(c.ExcessOhms(acceptedAt)) <= 3 * T,
                $"excess {c.ExcessOhms(acceptedAt):G3} Ohm at {acceptedAt:F3} s"
            );
            Assert.True(Math.Abs(a.Value.Value - ExponentialCase.R) <= 3 * T, $"accepted {a.Value.Value:F4} Ohm");
        }

        // Liveness: once the excess is a tenth of the noise (and of the target), 40 readings before the 20 s limit
        // suffice.
        var quiet = Math.Min(0.1 * T, 0.1 * c.NoiseOhms);
        var quietAt = c.Tau * Math.Log(Math.Max(1, Math.Abs(c.ExcessOhms(0)) / quiet));
        if (quietAt + (40 * c.Interval * 1.05) <= 20)
        {
            Assert.Equal(SettleState.Accepted, run.Final.State);
        }
    }

    [Property(Arbitrary = [typeof(SettleArbitraries)])]
    public void ConstantSlopeAboveThreshold_NeverAccepted(LinearCase c)
    {
        // |slope| × window >= 1 × target, twice the 0.5 × target limit; noise <= 5 % of target.
        var run = SettleTracker.Run(c.Readings(25), InventedMeter.R10k, InventedMeter.One);
        Assert.Equal(SettleState.Unstable, run.Final.State);
        Assert.Equal(UnstableReason.DriftingSlope, run.Final.Failure!.Reason);
    }
}
