using System.Globalization;
using SortRig.Planning.Ordering;
using Spectre.Console;
using static System.FormattableString;

namespace SortRig.Host.OrderVerb;

/// <summary>Prints an order estimate: one row per confidence and nominal, then one line on how it was found.</summary>
internal static class OrderView
{
    public static void Write(
        IAnsiConsole console,
        OrderEstimate e,
        string stockSource,
        string uncertaintySource,
        bool repeatable
    )
    {
        console.MarkupLine(
            Markup.Escape(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"Order for {e.SetsWanted} set(s) of {e.RecipeName} ({e.PartsPerSet} parts a set): stock "
                        + $"{e.Stock} ({stockSource}), transfer uncertainty {e.TransferUncertainty * 1e6:0.#} ppm ("
                        + $"{uncertaintySource})"
                )
            )
        );
        var table = new Table().Border(TableBorder.Rounded);
        foreach (var c in new[] { "confidence", "nominal", "per set", "buy", "expected leftover", "cost", "cheaper" })
        {
            table.AddColumn(new TableColumn(c).RightAligned());
        }

        foreach (var level in e.Levels)
        {
            if (level.SetEquivalents is null)
            {
                table.AddRow(Percent(level.Confidence), "—", "—", "more than --max-parts", "—", "—", "—");
                continue;
            }

            foreach (var line in level.Lines)
            {
                table.AddRow(
                    Percent(level.Confidence),
                    Ohms(line.Nominal),
                    Invariant($"{line.PerSet}"),
                    Invariant($"{line.Quantity}"),
                    Invariant($"{line.ExpectedLeftover:0.0}"),
                    line.Cost is { } c ? Invariant($"{c:0.00}") : "—",
                    line.CheaperQuantity is { } q ? Invariant($"{q} for {line.CheaperCost:0.00}") : ""
                );
            }
        }

        console.Write(table);
        foreach (var level in e.Levels.Where(l => l.SetEquivalents is not null))
        {
            var cost = level.TotalCost is { } t
                ? Invariant($", cost {t:0.00} (cheaper break taken where one is shown)")
                : "";
            console.MarkupLine(
                Markup.Escape(
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"{Percent(level.Confidence)}: buy {level.TotalParts} parts"
                            + $"{(level.Trimmed ? " (trimmed per nominal)" : "")}{cost}; {level.Reached * 100:0.#} % "
                            + $"of trials made {e.SetsWanted} sets from it"
                    )
                )
            );
        }

        var method = repeatable
            ? "window sweep per trial (repeatable by seed)"
            : "time-limited search per trial (not repeatable)";
        console.MarkupLine(
            Markup.Escape(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"{e.Trials} trials, seed {e.Seed}, {e.NotReached} not reached within --max-parts; mean smallest "
                        + $"order {e.MeanSetEquivalents:0.0} sets' worth; {method}; {e.Elapsed.TotalSeconds:0.0} s"
                )
            )
        );
    }

    public static string Percent(double p) => Invariant($"{p * 100:0.#} %");

    public static string Ohms(double ohms) =>
        ohms switch
        {
            >= 1e6 => Invariant($"{ohms / 1e6:0.###}M"),
            >= 1e3 => Invariant($"{ohms / 1e3:0.###}k"),
            _ => Invariant($"{ohms:0.###}"),
        };
}
