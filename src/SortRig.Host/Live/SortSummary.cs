using System.Globalization;
using SortRig.Engine.Announcing;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Readings;
using Spectre.Console;

namespace SortRig.Host.Live;

/// <summary>
/// The table printed when a session ends: per cup, the count and the spread of values; then the pace (seconds per
/// part and parts per hour, first accepted part to last, see <see cref="SortPace"/>) and which settle rule accepted
/// how many parts.
/// </summary>
internal static class SortSummary
{
    public static void Write(IAnsiConsole console, SortOutcome outcome, BenchSnapshot snapshot)
    {
        var parts = snapshot.Parts();
        var table = new Table()
            .Border(TableBorder.Rounded)
            .Title($"session {outcome.SessionId}: {outcome.PartsRecorded} parts");
        table.AddColumn("cup");
        table.AddColumn(new TableColumn("parts").RightAligned());
        table.AddColumn(new TableColumn("lowest").RightAligned());
        table.AddColumn(new TableColumn("highest").RightAligned());
        table.AddColumn(new TableColumn("spread").RightAligned());
        foreach (
            var cup in parts
                .Where(p => p.Cup is not null && p.State is "Accepted" or "Announced")
                .GroupBy(p => p.Cup!)
                .OrderBy(g => g.Key, StringComparer.Ordinal)
        )
        {
            var lo = cup.Min(p => p.DeviationPpm ?? 0);
            var hi = cup.Max(p => p.DeviationPpm ?? 0);
            table.AddRow(
                cup.Key,
                cup.Count().ToString(CultureInfo.InvariantCulture),
                OhmsText.Ppm(lo),
                OhmsText.Ppm(hi),
                OhmsText.Ppm(hi - lo)
            );
        }

        console.Write(table);
        var accepted = parts.Where(p => p.State is "Accepted" or "Announced").ToList();
        var pace = SortPace.From(accepted.Select(p => p.Time));
        if (pace.SecondsPerPart is { } perPart && pace.PartsPerHour is { } perHour)
        {
            var byRule = string.Join(
                ", ",
                accepted
                    .Where(p => p.AcceptedBy is not null)
                    .GroupBy(p => p.AcceptedBy!)
                    .OrderBy(g => g.Key, StringComparer.Ordinal)
                    .Select(g => $"{g.Key.ToLowerInvariant()} {g.Count()}")
            );
            console.MarkupLine(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"pace {perPart:0.0} s per part, {perHour:0} parts per hour (first accepted part to last, "
                        + $"{pace.Parts} parts){(byRule.Length > 0 ? $"; settled by {byRule}" : "")}"
                )
            );
        }

        console.MarkupLine(
            string.Create(
                CultureInfo.InvariantCulture,
                $"accepted {outcome.Accepted}, unstable {outcome.Unstable}, meter faults recovered {outcome.Faults}"
                    + $"{(outcome.StorageFaults > 0 ? $", storage faults waited out {outcome.StorageFaults}" : "")}"
                    + $"{(outcome.FinishedByOperator ? ", finished by the operator" : "")}"
            )
        );
    }
}
