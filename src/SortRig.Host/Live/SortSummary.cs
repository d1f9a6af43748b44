using System.Globalization;
using Spectre.Console;
using SortRig.Engine.Announcing;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Readings;

namespace SortRig.Host.Live;

/// <summary>The table printed when a session ends: per cup, the count and the spread of values.</summary>
internal static class SortSummary
{
    public static void Write(IAnsiConsole console, SortOutcome outcome, BenchSnapshot snapshot)
    {
        var parts = snapshot.Parts();
        var table = new Table().Border(TableBorder.Rounded).Title($"session {outcome.SessionId}: {outcome.PartsRecorded} parts");
        table.AddColumn("cup");
        table.AddColumn(new TableColumn("parts").RightAligned());
        table.AddColumn(new TableColumn("lowest").RightAligned());
        table.AddColumn(new TableColumn("highest").RightAligned());
        table.AddColumn(new TableColumn("spread").RightAligned());
        foreach (var cup in parts.Where(p => p.Cup is not null && p.State is "Accepted" or "Announced")
                     .GroupBy(p => p.Cup!).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var lo = cup.Min(p => p.DeviationPpm ?? 0);
            var hi = cup.Max(p => p.DeviationPpm ?? 0);
            table.AddRow(
                cup.Key,
                cup.Count().ToString(CultureInfo.InvariantCulture),
                OhmsText.Ppm(lo),
                OhmsText.Ppm(hi),
                OhmsText.Ppm(hi - lo));
        }

        console.Write(table);
        console.MarkupLine(string.Create(CultureInfo.InvariantCulture,
            $"accepted {outcome.Accepted}, unstable {outcome.Unstable}, meter faults recovered {outcome.Faults}{(outcome.StorageFaults > 0 ? $", storage faults waited out {outcome.StorageFaults}" : "")}{(outcome.FinishedByOperator ? ", finished by the operator" : "")}"));
    }
}
