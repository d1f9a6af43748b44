using SortRig.Measurement.Settling;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>Settle rule examples at 1 NPLC (22 ms between readings) on a 10 kOhm part; target 10 ppm = 0.1
/// Ohm.</summary>
public sealed class SettleTrackerTests
{
    private const double Dt = 0.022;

    [Fact]
    public void Add_SteadyPartAfterEmpty_BouncesThenAcceptsFullWindow()
    {
        var tracker = Tracker();
        var noise = Gaussian(7, 0.002);
        var verdicts = tracker.Feed([OverloadAt(0), OverloadAt(Dt), .. Sampled(0.1, Dt, 40, _ => 10_000.0 + noise())]);

        Assert.Equal(SettleState.Empty, verdicts[0].State);
        // Readings at 0.100, 0.122, 0.144 s are within 50 ms of the insertion at 0.100 s.
        Assert.All(verdicts.Skip(2).Take(3), v => Assert.Equal(SettleState.Bouncing, v.State));
        Assert.Equal(SettleState.Settling, verdicts[5].State);
        var accepted = Assert.Single(verdicts, v => v.State == SettleState.Accepted);
        var a = accepted.Acceptance!;
        Assert.Equal(8, a.Readings.Count);
        Assert.All(a.Readings, r => Assert.True(r.Time >= Start + TimeSpan.FromSeconds(0.15)));
        // Earliest: 8 readings from 0.166 s, the last at 0.320 s, 0.22 s after insertion.
        Assert.True(a.TimeToSettle >= TimeSpan.FromSeconds(0.219));
        Assert.Equal(10_000.0, a.Value.Value, 2);
        Assert.True(a.Value.TransferUncertainty < a.Value.StandardUncertainty);
        Assert.Equal(SettleState.AwaitingRemoval, tracker.State);
    }

    [Fact]
    public void Add_OverloadFlickerDuringBounce_IsIgnored()
    {
        var tracker = Tracker();
        tracker.Feed([At(0, 10_000), OverloadAt(0.01), At(0.02, 10_000), OverloadAt(0.03)]);
        Assert.Equal(SettleState.Bouncing, tracker.State);
        var verdicts = tracker.Feed(Sampled(0.06, Dt, 30, _ => 10_000.0));
        var accepted = Assert.Single(verdicts, v => v.State == SettleState.Accepted);
        Assert.Equal(0, accepted.Live.Flickers);
    }

    [Fact]
    public void Add_FlickerWhileSettling_RestartsTheWindow()
    {
        var tracker = Tracker();
        tracker.Feed(Sampled(0, Dt, 6, _ => 10_000.0));
        var flicker = tracker.Add(OverloadAt(6 * Dt));
        Assert.Equal(SettleState.Settling, flicker.State);
        var after = tracker.Add(At(7 * Dt, 10_000.0));
        Assert.Equal(1, after.Live.Flickers);
        Assert.Equal(1, after.Live.ReadingsCollected);
        var accepted = Assert.Single(tracker.Feed(Sampled(8 * Dt, Dt, 20, _ => 10_000.0)), v =>
            v.State == SettleState.Accepted
        );
        Assert.All(accepted.Acceptance!.Readings, r => Assert.True(r.Time > Start + TimeSpan.FromSeconds(6 * Dt)));
    }

    [Fact]
    public void Add_AfterAcceptance_IgnoresPartUntilTwoOverloads()
    {
        var tracker = Tracker();
        Assert.Single(tracker.Feed(Sampled(0, Dt, 30, _ => 10_000.0)), v => v.State == SettleState.Accepted);
        Assert.All(tracker.Feed(Sampled(30 * Dt, Dt, 50, _ => 10_000.0)), v =>
            Assert.Equal(SettleState.AwaitingRemoval, v.State)
        );
        var t = 80 * Dt;
        Assert.Equal(SettleState.AwaitingRemoval, tracker.Add(OverloadAt(t)).State);
        Assert.Equal(SettleState.AwaitingRemoval, tracker.Add(At(t + Dt, 10_000.0)).State);
        Assert.Equal(SettleState.AwaitingRemoval, tracker.Add(OverloadAt(t + (2 * Dt))).State);
        Assert.Equal(SettleState.Removed, tracker.Add(OverloadAt(t + (3 * Dt))).State);
        Assert.Equal(SettleState.Empty, tracker.State);
        Assert.Equal(SettleState.Bouncing, tracker.Add(At(t + (4 * Dt), 20_000.0)).State);
    }

    [Fact]
    public void Add_SteadyDrift_EndsUnstableWithDriftingSlope()
    {
        // 50 ppm/s = 0.5 Ohm/s, noise 0.2 ppm: slope t ≈ 35 on every window; 20 s pass without acceptance.
        var noise = Gaussian(11, 0.002);
        var run = SettleTracker.Run(
            Sampled(0, Dt, 2000, t => 10_000.0 + (0.5 * t) + noise()),
            InventedMeter.R10k,
            InventedMeter.One
        );
        Assert.Equal(SettleState.Unstable, run.Final.State);
        Assert.Equal(UnstableReason.DriftingSlope, run.Final.Failure!.Reason);
        Assert.True(run.Final.Failure.Elapsed > TimeSpan.FromSeconds(20));
        Assert.InRange(run.Final.Live.SlopePpmPerSecond!.Value, 45, 55);
    }

    [Fact]
    public void Add_NoisyPart_EndsUnstableWithNoisySem()
    {
        // Noise 60 ppm rms: SEM ≈ 60/√8 = 21 ppm > 10 ppm target.
        var noise = Gaussian(5, 0.6);
        var run = SettleTracker.Run(
            Sampled(0, Dt, 2000, _ => 10_000.0 + noise()),
            InventedMeter.R10k,
            InventedMeter.One
        );
        Assert.Equal(UnstableReason.NoisySem, run.Final.Failure!.Reason);
    }

    [Fact]
    public void Add_RepeatedFlickers_EndsUnstableWithIntermittentContact()
    {
        var readings = Enumerable.Range(0, 1000).Select(i => i % 5 == 4 ? OverloadAt(i * Dt) : At(i * Dt, 10_000.0));
        var run = SettleTracker.Run(readings, InventedMeter.R10k, InventedMeter.One);
        Assert.Equal(UnstableReason.IntermittentContact, run.Final.Failure!.Reason);
    }

    [Fact]
    public void Add_ReadingsTooSlowForMaxTime_EndsUnstableWithTooFewReadings()
    {
        // One reading every 3 s: the eighth arrives at 21 s, after the 20 s limit.
        var run = SettleTracker.Run(Sampled(0, 3.0, 20, _ => 10_000.0), InventedMeter.R10k, InventedMeter.One);
        Assert.Equal(UnstableReason.TooFewReadings, run.Final.Failure!.Reason);
        Assert.Equal(8, run.ReadingsUsed);
    }

    [Fact]
    public void Excuse_GapsWithoutReadings_AreNotCountedAgainstMaxTime()
    {
        // The same slow stream as above (a reading every 3 s), but the host says each gap beyond one
        // reading period was an outage: the limit counts only time with readings coming, so the part
        // settles (the limit gives up on parts, not on a link; common practice, no source).
        var tracker = Tracker();
        var verdicts = new List<SettleVerdict>();
        foreach (var reading in Sampled(0, 3.0, 20, _ => 10_000.0))
        {
            if (tracker.State is SettleState.Bouncing or SettleState.Settling)
            {
                tracker.Excuse(TimeSpan.FromSeconds(3.0 - Dt));
            }

            verdicts.Add(tracker.Add(reading));
        }

        Assert.Contains(verdicts, v => v.State == SettleState.Accepted);
        Assert.DoesNotContain(verdicts, v => v.State == SettleState.Unstable);
    }

    [Fact]
    public void Excuse_WhenFixtureEmpty_IsForgottenByTheNextPart()
    {
        var tracker = Tracker();
        tracker.Excuse(TimeSpan.FromMinutes(10));
        var run = tracker.Feed(Sampled(0, 3.0, 20, _ => 10_000.0));
        Assert.Equal(UnstableReason.TooFewReadings, run.First(v => v.State == SettleState.Unstable).Failure!.Reason);
    }

    [Fact]
    public void Add_MinReadingsAboveWindow_DelaysAcceptance()
    {
        var tracker = Tracker(new SettleOptions { MinReadings = 20 });
        var verdicts = tracker.Feed(Sampled(0, Dt, 40, _ => 10_000.0));
        // Reading 0 is the insertion, readings 1 and 2 are within the bounce; 20 counted readings end at index 22.
        Assert.Equal(22, verdicts.FindIndex(v => v.State == SettleState.Accepted));
    }

    [Fact]
    public void Remeasure_AfterAcceptance_SettlesAgainWithoutBounce()
    {
        var tracker = Tracker();
        tracker.Feed(Sampled(0, Dt, 30, _ => 10_000.0));
        tracker.Remeasure();
        Assert.Equal(SettleState.Settling, tracker.State);
        var verdicts = tracker.Feed(Sampled(30 * Dt, Dt, 20, _ => 10_001.0));
        Assert.Equal(7, verdicts.FindIndex(v => v.State == SettleState.Accepted));
        Assert.Equal(10_001.0, verdicts[7].Acceptance!.Value.Value, 9);
        Assert.Equal(7 * Dt, verdicts[7].Acceptance!.TimeToSettle.TotalSeconds, 6);
    }

    [Fact]
    public void Reset_ReturnsToEmpty()
    {
        var tracker = Tracker();
        tracker.Feed(Sampled(0, Dt, 5, _ => 10_000.0));
        tracker.Reset();
        Assert.Equal(SettleState.Empty, tracker.State);
        Assert.Equal(SettleState.Bouncing, tracker.Add(At(1, 10_000.0)).State);
    }

    [Fact]
    public void Run_StopsAtTheVerdict()
    {
        var consumed = 0;
        IEnumerable<SortRig.Measurement.Readings.Reading> Counting()
        {
            foreach (var r in Sampled(0, Dt, 100, _ => 10_000.0))
            {
                consumed++;
                yield return r;
            }
        }

        var run = SettleTracker.Run(Counting(), InventedMeter.R10k, InventedMeter.One);
        Assert.Equal(SettleState.Accepted, run.Final.State);
        // Insertion + 2 bounce readings + 8 window readings.
        Assert.Equal(11, run.ReadingsUsed);
        Assert.Equal(11, consumed);
    }

    [Fact]
    public void Add_ReadingOlderThanPrevious_Throws()
    {
        var tracker = Tracker();
        tracker.Add(At(1, 10_000));
        var ex = Assert.Throws<ArgumentException>(() => tracker.Add(At(0.5, 10_000)));
        Assert.Contains("time order", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Add_ReadingFromAnotherRange_Throws()
    {
        var tracker = Tracker();
        Assert.Throws<ArgumentException>(() =>
            tracker.Add(SortRig.Measurement.Readings.Reading.Finite(10_000, Start, 100_000))
        );
    }

    [Fact]
    public void Options_WindowTooShort_ThrowsNamingTheOption()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new SettleOptions { WindowLength = 2 });
        Assert.Equal("WindowLength", ex.ParamName);
        Assert.Contains("[3, 1000]", ex.Message, StringComparison.Ordinal);
    }
}
