using SortRig.Engine.Events;
using SortRig.Host.Live;

namespace SortRig.Host.Tests.Checking;

/// <summary>The console view keeps the last word about the check standard apart from the rolling notices.</summary>
public sealed class CheckLiveViewTests
{
    private static BenchEvent Notice(long id, string text) => new(id, BenchEventKind.Notice, default, Text: text);

    [Fact]
    public void Apply_CheckStateLines_KeptAsLastCheck_PromptsAndOtherNoticesIgnored()
    {
        var m = LiveViewModel
            .Empty(10)
            .Apply(Notice(1, "check (start): put the check standard fixture:10000 (10000 Ohm) in the fixture"))
            .Apply(Notice(2, "check limits set: 5 readings, centre 9998.1100 Ohm, sigma 2.0 ppm"));
        Assert.StartsWith("check limits set", m.LastCheck, StringComparison.Ordinal);

        m = m.Apply(Notice(3, "check 7 out of control: the check read +25.0 sigma from its centre, beyond the limits."))
            .Apply(Notice(4, "check (re-reference): put the check standard fixture:10000 (10000 Ohm) in the fixture"))
            .Apply(Notice(5, "check read 9998.6038 Ohm: take the check standard out"))
            .Apply(Notice(6, "measure again: take part 101 out of cup F and put it in the fixture"))
            .Apply(Notice(7, "part 101 undone: take it out of F and measure it again"))
            .Apply(Notice(8, "carrying on"))
            .Apply(Notice(9, "another notice"));

        Assert.StartsWith("check 7 out of control", m.LastCheck, StringComparison.Ordinal);
        Assert.Equal(4, m.Notices.Count);
        Assert.Null(LiveViewModel.Empty(1).Apply(Notice(1, "ready")).LastCheck);
    }
}
