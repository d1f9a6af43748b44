using SortRig.Engine.Sorting;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Engine.Tests.Sorting;

/// <summary>The fixture watch as a pure step (thresholds are our choice, common practice, no source).</summary>
public sealed class FixtureWatchTests
{
    private static readonly DateTimeOffset s_t0 = new(2026, 3, 1, 9, 0, 0, TimeSpan.Zero);
    private static readonly TimeSpan s_period = TimeSpan.FromSeconds(0.5);

    private static FixtureWatch Watch() => new(s_period, TimeSpan.FromSeconds(5), v => 25e-6 * v);

    private static Reading At(double seconds, double ohms = 10_000) =>
        Reading.Finite(ohms, s_t0.AddSeconds(seconds), 10_000);

    [Fact]
    public void Stall_GapLongerThanTheStallGapWhileSettling_MeasuresAgain()
    {
        var watch = Watch();
        Assert.Equal(FixtureAction.None, watch.CheckStall(At(0), SettleState.Settling).Action);
        var verdict = watch.CheckStall(At(8), SettleState.Settling);
        Assert.Equal(FixtureAction.Remeasure, verdict.Action);
        Assert.Equal("no reading for 8 s: measuring the part again", verdict.Message);
    }

    [Fact]
    public void Stall_ShortLateGapWhileSettling_IsExcusedLessOnePeriod()
    {
        var watch = Watch();
        watch.CheckStall(At(0), SettleState.Settling);
        Assert.Equal(
            new FixtureVerdict(FixtureAction.Excuse, TimeSpan.FromSeconds(2.5)),
            watch.CheckStall(At(3), SettleState.Settling)
        );
        Assert.Equal(FixtureAction.None, watch.CheckStall(At(3.5), SettleState.Settling).Action); // on time
    }

    [Fact]
    public void Stall_GapAfterAMeterFault_IsExcusedNeverAStall()
    {
        var watch = Watch();
        watch.CheckStall(At(0), SettleState.Settling);
        watch.NoteStreamBroken(SettleState.Settling);
        Assert.Equal(FixtureAction.Excuse, watch.CheckStall(At(30), SettleState.Settling).Action);
    }

    [Fact]
    public void Swap_TwoFarReadingsAfterABrokenStream_IsANewPart()
    {
        var watch = Watch();
        watch.NoteDecided(10_000);
        watch.CheckStall(At(0), SettleState.AwaitingRemoval);
        watch.NoteStreamBroken(SettleState.AwaitingRemoval);
        // 10.1 kOhm is 1 % away, far beyond 25 ppm: once is a garbled reply, twice in a row another part.
        Assert.Equal(FixtureAction.None, watch.CheckSwap(At(1, 10_100), SettleState.AwaitingRemoval, (7, "C")).Action);
        var verdict = watch.CheckSwap(At(1.5, 10_100), SettleState.AwaitingRemoval, (7, "C"));
        Assert.Equal(FixtureAction.NewPart, verdict.Action);
        Assert.StartsWith("a new part went in", verdict.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Swap_SameValueStillThereAfterTwentySeconds_IsANewPartNamingTheLastOne()
    {
        var watch = Watch();
        watch.NoteDecided(10_000);
        watch.NoteStreamBroken(SettleState.AwaitingRemoval);
        Assert.Equal(
            FixtureAction.None,
            watch.CheckSwap(At(0, 10_000.01), SettleState.AwaitingRemoval, (7, "C")).Action
        );
        Assert.Equal(
            FixtureAction.None,
            watch.CheckSwap(At(19, 10_000.01), SettleState.AwaitingRemoval, (7, "C")).Action
        );
        var verdict = watch.CheckSwap(At(21, 10_000.01), SettleState.AwaitingRemoval, (7, "C"));
        Assert.Equal(FixtureAction.NewPart, verdict.Action);
        Assert.EndsWith("(if it is part 7, put it in cup C and press U)", verdict.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Swap_NoBrokenStream_NeverFires()
    {
        var watch = Watch();
        watch.NoteDecided(10_000);
        for (var i = 0; i < 100; i++)
        {
            Assert.Equal(FixtureAction.None, watch.CheckSwap(At(i, 12_000), SettleState.AwaitingRemoval, null).Action);
        }
    }
}
