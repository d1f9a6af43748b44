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
    bool Finished
)
{
    /// <summary>The last word about the check standard ("check 4 in control (+0.3 sigma)", "... out of control: ..."),
    /// or null when the session reads no check.</summary>
    public string? LastCheck { get; init; }

    private const int NoticeLines = 4;

    /// <summary>The view before anything happened.</summary>
    public static LiveViewModel Empty(int partsPlanned) =>
        new(0, partsPlanned, null, null, new Dictionary<string, int>(), [], false);

    /// <summary>The view after one more event.</summary>
    public LiveViewModel Apply(BenchEvent e) =>
        e.Kind switch
        {
            BenchEventKind.Reading => this with { LastReading = e },
            BenchEventKind.Announcement => this with
            {
                LastAnnouncement = e,
                PartsDone = e.State == "Repeat" ? PartsDone : PartsDone + 1,
            },
            BenchEventKind.Counts => this with { Counts = e.Counts ?? Counts },
            BenchEventKind.Notice => this with
            {
                Notices = [.. Notices.TakeLast(NoticeLines - 1), e.Text ?? ""],
                LastCheck = IsCheckState(e.Text) ? e.Text : LastCheck,
            },
            BenchEventKind.Finished => this with { Finished = true },
            _ => this,
        };

    // The check's state lines (not its prompts: "check (start): put the check standard ...").
    private static bool IsCheckState(string? text) =>
        text is not null
        && (
            text.StartsWith("check limits set", StringComparison.Ordinal)
            || (
                text.StartsWith("check ", StringComparison.Ordinal)
                && text.Contains(" control", StringComparison.Ordinal)
            )
            || text.StartsWith("re-referenced", StringComparison.Ordinal)
        );
}
