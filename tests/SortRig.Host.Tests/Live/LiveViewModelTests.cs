using SortRig.Engine.Events;
using SortRig.Host.Live;

namespace SortRig.Host.Tests.Live;

public sealed class LiveViewModelTests
{
    [Fact]
    public void Apply_Announcements_CountPartsButNotRepeats()
    {
        var m = LiveViewModel
            .Empty(10)
            .Apply(new BenchEvent(1, BenchEventKind.Announcement, default, PartNumber: 1, Cup: "A", State: "Cup"))
            .Apply(new BenchEvent(2, BenchEventKind.Announcement, default, PartNumber: 1, Cup: "A", State: "Repeat"))
            .Apply(new BenchEvent(3, BenchEventKind.Announcement, default, PartNumber: 2, Cup: "R", State: "Reject"));

        Assert.Equal(2, m.PartsDone);
        Assert.Equal("R", m.LastAnnouncement!.Cup);
    }

    [Fact]
    public void Apply_Notices_KeepsTheLastFour()
    {
        var m = LiveViewModel.Empty(0);
        for (var i = 1; i <= 6; i++)
        {
            m = m.Apply(new BenchEvent(i, BenchEventKind.Notice, default, Text: $"n{i}"));
        }

        Assert.Equal(["n3", "n4", "n5", "n6"], m.Notices);
    }
}
