using System.Globalization;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.Announcing;

/// <summary>
/// One plain line per announcement on a text writer (standard output by default). Used when the
/// console is not interactive; scripts and tests read these lines.
/// Format: <c>part 17: cup C  10.00321 kOhm  +321 ppm</c>.
/// </summary>
public sealed class PlainTextAnnouncer(TextWriter writer) : IAnnouncer
{
    private readonly Lock _gate = new();

    /// <inheritdoc />
    public ValueTask AnnounceAsync(Announcement announcement, CancellationToken cancellationToken)
    {
        lock (_gate)
        {
            writer.WriteLine(Describe(announcement));
            writer.Flush();
        }

        return ValueTask.CompletedTask;
    }

    /// <summary>The line written for an announcement.</summary>
    public static string Describe(Announcement a) =>
        a.Kind switch
        {
            AnnouncementKind.Info => "note: " + a.Text,
            AnnouncementKind.Unstable => string.Create(
                CultureInfo.InvariantCulture,
                $"part {a.PartNumber}: unstable - {a.Text}"
            ),
            AnnouncementKind.Repeat => string.Create(
                CultureInfo.InvariantCulture,
                $"part {a.PartNumber}: cup {a.Label} (repeated)  {OhmsText.Format(a.Ohms)}  "
                    + $"{OhmsText.Ppm(a.DeviationPpm)}"
            ),
            _ => string.Create(
                CultureInfo.InvariantCulture,
                $"part {a.PartNumber}: cup {a.Label}  {OhmsText.Format(a.Ohms)}  {OhmsText.Ppm(a.DeviationPpm)}"
                    + $"{(a.CompletesSet ? "  set complete" : "")}"
            ),
        };
}
