using SortRig.Engine.Events;

namespace SortRig.Host.Live;

/// <summary>
/// What the live console view shows, folded from the bench event stream. Pure: no console here,
/// so the folding is testable.
/// </summary>
internal sealed record LiveViewModel(
    int PartsDone,
    int PartsPlanned,
    BenchEvent? LastAnnouncement,
    BenchEvent? LastReading,
    IReadOnlyDictionary<string, int> Counts,
    IReadOnlyList<string> Notices,
    bool Finished)
{
    private const int NoticeLines = 4;

    /// <summary>The view before anything happened.</summary>
    public static LiveViewModel Empty(int partsPlanned) =>
        new(0, partsPlanned, null, null, new Dictionary<string, int>(), [], false);

    /// <summary>The view after one more event.</summary>
    public LiveViewModel Apply(BenchEvent e) => e.Kind switch
    {
        BenchEventKind.Reading => this with { LastReading = e },
        BenchEventKind.Announcement => this with
        {
            LastAnnouncement = e,
            PartsDone = e.State == "Repeat" ? PartsDone : PartsDone + 1,
        },
        BenchEventKind.Counts => this with { Counts = e.Counts ?? Counts },
        BenchEventKind.Notice => this with { Notices = [.. Notices.TakeLast(NoticeLines - 1), e.Text ?? ""] },
        BenchEventKind.Finished => this with { Finished = true },
        _ => this,
    };
}
