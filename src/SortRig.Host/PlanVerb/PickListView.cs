using System.Globalization;
using SortRig.Engine.Picking;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Planning.Networks;
using SortRig.Planning.PickLists;
using Spectre.Console;

namespace SortRig.Host.PlanVerb;

/// <summary>Prints a plan: per set, what to pick (position, part, where, value) and its outputs; then a
/// summary.</summary>
internal static class PickListView
{
    // The output the matched form judges (SetAssembler and PickListBuilder name it so).
    private const string MatchedOutput = "ratio-match";

    public static void Write(IAnsiConsole console, PlanOutcome outcome, string title)
    {
        var list = outcome.List;
        var byCup = list.Source == PickSource.Cups;
        foreach (var set in list.Sets)
        {
            var picks = new Table()
                .Border(TableBorder.Rounded)
                .Title(
                    Markup.Escape(
                        FormattableString.Invariant($"set {set.Number} of {list.RecipeName}, score {set.Score:F3}")
                    )
                );
            foreach (
                var c in new[]
                {
                    "position",
                    "build",
                    "part",
                    byCup ? "cup" : "where",
                    "nominal",
                    byCup ? "cup band (ppm)" : "value (Ohm)",
                }
            )
            {
                picks.AddColumn(c);
            }

            foreach (var item in set.Items)
            {
                picks.AddRow(
                    Markup.Escape(item.Position),
                    item.Build,
                    item.PartId?.ToString(CultureInfo.InvariantCulture) ?? "any",
                    Markup.Escape(item.Source),
                    Markup.Escape(OhmsText.Nominal(item.Nominal)),
                    byCup ? Band(outcome, item.Nominal, item.Source)
                        : item.Value is { } v ? Format.Value(v)
                        : ""
                );
            }

            console.Write(picks);
            console.Write(Outputs(set.Outputs));
        }

        var unused = outcome.UnusedIds;
        var made = list.Sets.Count == 0 ? "[yellow]no set can be made[/]" : $"[green]{list.Sets.Count} set(s)[/]";
        console.MarkupLine(
            $"{made} of {Markup.Escape(list.RecipeName)} from {Markup.Escape(title)}: "
                + $"{outcome.Offered.Count} part(s) offered, {outcome.PickedIds.Count} picked, {unused.Count} unused"
                + (unused.Count is > 0 and <= 40 ? $" ({string.Join(", ", unused)})" : "")
        );
        console.MarkupLine(Markup.Escape(outcome.Note));
    }

    private static Table Outputs(IReadOnlyList<OutputCheck> outputs)
    {
        var table = new Table().NoBorder();
        foreach (var c in new[] { "  output", "value", "target", "error", "worst case", "tolerance", "pass" })
        {
            table.AddColumn(new TableColumn(c).Padding(0, 0, 2, 0));
        }

        foreach (var o in outputs)
        {
            table.AddRow(
                "  " + Markup.Escape(o.Name),
                Number(o.Value, o.Unit, o.Name),
                Number(o.Target, o.Unit, o.Name),
                Error(o.Error, o.Unit),
                Error(o.WorstCaseError, o.Unit),
                Error(o.Tolerance, o.Unit),
                o.Meets ? "[green]yes[/]" : "[red]no[/]"
            );
        }

        return table;
    }

    private static string Band(PlanOutcome outcome, double nominal, string cup) =>
        outcome.CupBands.TryGetValue((nominal, cup), out var b)
            ? $"{Format.Ppm(b.LowPpm)} .. {Format.Ppm(b.HighPpm)}"
            : "";

    // A node voltage is in volts, a ratio or gain a plain number; the matched form's one output is the spread in ppm.
    private static string Number(double x, string unit, string name) =>
        x.ToString("G8", CultureInfo.InvariantCulture)
        + (
            unit == "V" ? " V"
            : name == MatchedOutput ? " ppm"
            : ""
        );

    // Errors in ppm, or in mV for node voltages.
    private static string Error(double x, string unit) =>
        unit == "V"
            ? (x * 1e3).ToString("0.0000", CultureInfo.InvariantCulture) + " mV"
            : x.ToString("0.0", CultureInfo.InvariantCulture) + " ppm";
}
