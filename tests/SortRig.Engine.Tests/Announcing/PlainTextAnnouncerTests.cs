using SortRig.Engine.Announcing;

namespace SortRig.Engine.Tests.Announcing;

public sealed class PlainTextAnnouncerTests
{
    [Fact]
    public async Task Announce_Cup_WritesOneParsableLine()
    {
        var writer = new StringWriter();
        var announcer = new PlainTextAnnouncer(writer);

        await announcer.AnnounceAsync(
            new Announcement(AnnouncementKind.Cup, 17, "C", 10_003.2, 320, "", CompletesSet: true),
            default
        );

        Assert.Equal("part 17: cup C  10.00320 kOhm  +320 ppm  set complete" + Environment.NewLine, writer.ToString());
    }

    [Fact]
    public async Task Announce_Repeat_IsMarkedRepeated()
    {
        var writer = new StringWriter();
        await new PlainTextAnnouncer(writer).AnnounceAsync(
            new Announcement(AnnouncementKind.Repeat, 3, "A", 9_990, -1000, ""),
            default
        );
        Assert.StartsWith("part 3: cup A (repeated)", writer.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void SpeechWords_NeverReadNumbers() =>
        Assert.Equal("cup B", SpeechAnnouncer.Words(new Announcement(AnnouncementKind.Cup, 5, "B", 10_001, 100, "")));
}
