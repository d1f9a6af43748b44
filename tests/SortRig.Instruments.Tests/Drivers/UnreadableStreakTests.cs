using SortRig.Instruments.Drivers;
using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Tests.Drivers;

/// <summary>Replies that are not a reading, in a row: growing waits, a stop at the limit, a fresh count after a good
/// reading.</summary>
public sealed class UnreadableStreakTests
{
    // 9.91E37 is SCPI's not-a-number value (SCPI-99 vol. 1 sec. 7.2.1.5).
    private static readonly ScpiResponseException s_nan = new(
        "READ?",
        "+9.91000000E+37",
        "a reading (9.91E37 is the SCPI not-a-number value)"
    );
    private static readonly Backoff s_backoff = new(TimeSpan.FromMilliseconds(250), TimeSpan.FromSeconds(5));

    [Fact]
    public void Waits_DoubleFromTheFirstUpToTheLast()
    {
        var streak = new UnreadableStreak(s_backoff, limit: 12);

        var waits = Enumerable.Range(0, 11).Select(_ => streak.Note(s_nan).TotalSeconds).ToArray();

        // Doubling from 0.25 s, held at 5 s (worked by hand).
        Assert.Equal([0.25, 0.5, 1, 2, 4, 5, 5, 5, 5, 5, 5], waits);
        Assert.Equal(37.75, waits.Sum(), 9);
        Assert.Equal(11, streak.Count);
    }

    [Fact]
    public void TheLimitInARow_ThrowsNamingTheReply()
    {
        var streak = new UnreadableStreak(s_backoff, limit: 3);
        streak.Note(s_nan);
        streak.Note(s_nan);

        var e = Assert.Throws<MeterUnreadableException>(() => streak.Note(s_nan));

        Assert.Equal(3, e.Count);
        Assert.Equal("+9.91000000E+37", e.LastReply);
        Assert.Contains("3 reading requests in a row with '+9.91000000E+37'", e.Message, StringComparison.Ordinal);
        Assert.False(MeterFaults.IsFault(e)); // a reconnect does not cure it: the job stops
    }

    [Fact]
    public void AGoodReading_StartsTheCountAndTheWaitsAgain()
    {
        var streak = new UnreadableStreak(s_backoff, limit: 3);
        streak.Note(s_nan);
        streak.Note(s_nan);

        streak.Reset();

        Assert.Equal(0, streak.Count);
        Assert.Equal(TimeSpan.FromMilliseconds(250), streak.Note(s_nan));
        Assert.Equal(TimeSpan.FromMilliseconds(500), streak.Note(s_nan));
    }

    [Fact]
    public void AReplyWithControlCharacters_IsShownEscapedAndCut()
    {
        var hostile = new ScpiResponseException(
            "READ?",
            "\u001b[2J" + new string('x', 60),
            "a number (NR1, NR2 or NR3)"
        );
        var streak = new UnreadableStreak(s_backoff, limit: 1);

        var e = Assert.Throws<MeterUnreadableException>(() => streak.Note(hostile));

        Assert.DoesNotContain('\u001b', e.Message);
        Assert.Contains("'\\x1B[2J" + new string('x', 33) + "...'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void ALimitBelowOne_IsRefused() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new UnreadableStreak(s_backoff, limit: 0));
}
