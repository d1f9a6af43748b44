using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Events;
using SortRig.Host.Live;

namespace SortRig.Host.Tests.Live;

public sealed class FramePacerTests
{
    // A reading every 20 ms for 10 s with an announcement every second (virtual time): the view draws
    // every announcement and at most one reading frame per 250 ms. Frame budget: common practice, no source.
    [Fact]
    public void Due_ReadingsAt50PerSecond_AtMostFourReadingFramesASecond_EveryAnnouncementDrawn()
    {
        var clock = new FakeTimeProvider();
        var pacer = new FramePacer(clock);
        int readingFrames = 0,
            announcementFrames = 0;
        for (var k = 0; k < 500; k++)
        {
            if (pacer.Due(BenchEventKind.Reading))
            {
                readingFrames++;
            }

            if (k % 50 == 49 && pacer.Due(BenchEventKind.Announcement))
            {
                announcementFrames++;
            }

            clock.Advance(TimeSpan.FromMilliseconds(20));
        }

        Assert.Equal(10, announcementFrames);
        Assert.InRange(readingFrames, 30, 40); // 10 s / 250 ms = 40 at most; the announcements' frames reset the wait
    }

    [Fact]
    public void Due_FirstReading_DrawnAtOnce_NextWithinIntervalSkipped_AfterIntervalDrawn()
    {
        var clock = new FakeTimeProvider();
        var pacer = new FramePacer(clock, TimeSpan.FromMilliseconds(250));
        Assert.True(pacer.Due(BenchEventKind.Reading));
        clock.Advance(TimeSpan.FromMilliseconds(249));
        Assert.False(pacer.Due(BenchEventKind.Reading));
        Assert.True(pacer.Due(BenchEventKind.Notice));
        clock.Advance(TimeSpan.FromMilliseconds(250));
        Assert.True(pacer.Due(BenchEventKind.Reading));
    }
}
