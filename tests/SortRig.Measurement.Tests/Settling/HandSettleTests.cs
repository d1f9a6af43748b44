using Microsoft.Extensions.Time.Testing;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>The settle rule for people typing a display (50 kOhm range of the invented hand-held: one digit = 1
/// Ohm).</summary>
public sealed class HandSettleTests
{
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2026, 12, 3, 8, 0, 0, TimeSpan.Zero));

    [Fact]
    public void Add_TwoEntriesAFewSecondsApartThatAgree_Accepted()
    {
        var settle = new HandSettle(TypedMeter.R50k);

        var first = settle.Add(Entry(10_003));
        _time.Advance(TimeSpan.FromSeconds(4));
        var second = settle.Add(Entry(10_004));

        Assert.Equal(HandSettleState.Confirming, first.State);
        Assert.Contains("wait a few seconds, read again", first.Prompt, StringComparison.Ordinal);
        Assert.Equal(HandSettleState.Accepted, second.State);
        Assert.Equal(10_003.5, second.Value!.Value, 9); // mean of the two agreeing entries (arithmetic)
        Assert.Equal(2, second.Entries!.Count);
    }

    [Fact]
    public void Add_EntryTooSoon_NotCounted_AndToldToWait()
    {
        var settle = new HandSettle(TypedMeter.R50k);
        settle.Add(Entry(10_003));
        _time.Advance(TimeSpan.FromSeconds(1));

        var soon = settle.Add(Entry(10_003));

        Assert.Equal(HandSettleState.TooSoon, soon.State);
        Assert.Equal(1, soon.Counted);
        Assert.Contains("let go of the part, wait 3 s, read again", soon.Prompt, StringComparison.Ordinal);
        _time.Advance(TimeSpan.FromSeconds(3));
        Assert.Equal(HandSettleState.Accepted, settle.Add(Entry(10_003)).State);
    }

    [Fact]
    public void Add_ReadingWandersWithWarmth_AsksAgainInPlainWords_ThenAcceptsWhenItStops()
    {
        var settle = new HandSettle(TypedMeter.R50k);
        var states = new List<HandSettleVerdict>();
        foreach (var ohms in (double[])[10_012, 10_008, 10_005, 10_004])
        {
            states.Add(settle.Add(Entry(ohms)));
            _time.Advance(TimeSpan.FromSeconds(5));
        }

        Assert.Equal(
            [HandSettleState.Confirming, HandSettleState.Moving, HandSettleState.Moving, HandSettleState.Accepted],
            states.Select(s => s.State)
        );
        Assert.Equal(
            "the reading moved from 10.012 kOhm to 10.008 kOhm: let go of the part, wait a few seconds, read again",
            states[1].Prompt
        );
        Assert.Equal(10_004.5, states[3].Value!.Value, 9);
        Assert.Equal(4, states[3].Entries!.Count);
    }

    [Fact]
    public void Add_ThreeAgreeingRequired_WhenConfigured()
    {
        var settle = new HandSettle(TypedMeter.R50k, new HandSettleOptions { Agreeing = 3 });

        var a = settle.Add(Entry(10_003));
        _time.Advance(TimeSpan.FromSeconds(3));
        var b = settle.Add(Entry(10_003));
        _time.Advance(TimeSpan.FromSeconds(3));
        var c = settle.Add(Entry(10_002));

        Assert.Equal(
            [HandSettleState.Confirming, HandSettleState.Confirming, HandSettleState.Accepted],
            new[] { a.State, b.State, c.State }
        );
    }

    [Fact]
    public void Add_StillMovingAtMaxEntries_Unstable_ThenRefusesUntilReset()
    {
        var settle = new HandSettle(TypedMeter.R50k, new HandSettleOptions { MaxEntries = 3 });
        HandSettleVerdict last = null!;
        foreach (var ohms in (double[])[10_020, 10_010, 10_000])
        {
            last = settle.Add(Entry(ohms));
            _time.Advance(TimeSpan.FromSeconds(3));
        }

        Assert.Equal(HandSettleState.Unstable, last.State);
        Assert.Contains("set the part aside to cool", last.Prompt, StringComparison.Ordinal);
        Assert.Throws<InvalidOperationException>(() => settle.Add(Entry(10_000)));
        settle.Reset();
        Assert.Equal(HandSettleState.Confirming, settle.Add(Entry(10_000)).State);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(11)]
    public void Options_AgreeingOutOfRange_Throws(int k) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new HandSettleOptions { Agreeing = k });

    [Fact]
    public void Add_OlderThanPrevious_Throws()
    {
        var settle = new HandSettle(TypedMeter.R50k);
        settle.Add(Entry(10_000));
        Assert.Throws<ArgumentException>(() =>
            settle.Add(Reading.Finite(10_000, _time.GetUtcNow().AddSeconds(-1), 50_000))
        );
    }

    private Reading Entry(double ohms) => Reading.Finite(ohms, _time.GetUtcNow(), 50_000);
}
