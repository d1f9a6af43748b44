using SortRig.Engine.Events;

namespace SortRig.Engine.Announcing;

/// <summary>Puts announcements on the bench event stream (live view, web page).</summary>
public sealed class HubAnnouncer(BenchEventHub hub) : IAnnouncer
{
    /// <inheritdoc />
    public ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
    {
        hub.Publish(
            new BenchEvent(
                0,
                announcement.Kind == AnnouncementKind.Info ? BenchEventKind.Notice : BenchEventKind.Announcement,
                default,
                PartNumber: announcement.PartNumber == 0 ? null : announcement.PartNumber,
                Cup: announcement.Label.Length == 0 ? null : announcement.Label,
                Value: double.IsNaN(announcement.Ohms) ? null : announcement.Ohms,
                DeviationPpm: double.IsNaN(announcement.DeviationPpm) ? null : announcement.DeviationPpm,
                State: announcement.Kind.ToString(),
                Text: announcement.Text
            )
        );
        return ValueTask.CompletedTask;
    }
}
