using System.Globalization;
using CsvHelper;
using SortRig.Planning.Ordering;
using SortRig.Reporting.Reports;

namespace SortRig.Host.OrderVerb;

/// <summary>The order and its curve as CSV (CsvHelper with <see cref="SpreadsheetCsv"/> options, invariant
/// culture).</summary>
internal static class OrderCsv
{
    public static readonly string[] OrderColumns =
    [
        "confidence",
        "nominal_ohm",
        "per_set",
        "quantity",
        "expected_leftover",
        "cost",
        "cheaper_quantity",
        "cheaper_cost",
        "reached",
    ];

    public static readonly string[] CurveColumns =
    [
        "set_equivalents",
        "parts_bought",
        "mean_sets",
        "sets_p05",
        "sets_median",
        "sets_p95",
    ];

    public static void WriteOrder(TextWriter writer, OrderEstimate estimate)
    {
        using var csv = CsvWriter.Create(writer, SpreadsheetCsv.Options, leaveOpen: true);
        Header(csv, OrderColumns);
        foreach (var level in estimate.Levels)
        {
            foreach (var line in level.Lines)
            {
                Row(
                    csv,
                    [
                        R(level.Confidence),
                        R(line.Nominal),
                        I(line.PerSet),
                        I(line.Quantity),
                        R(line.ExpectedLeftover),
                        O(line.Cost),
                        line.CheaperQuantity is { } q ? I(q) : "",
                        O(line.CheaperCost),
                        R(level.Reached),
                    ]
                );
            }
        }

        csv.Flush();
    }

    public static void WriteCurve(TextWriter writer, OrderEstimate estimate)
    {
        using var csv = CsvWriter.Create(writer, SpreadsheetCsv.Options, leaveOpen: true);
        Header(csv, CurveColumns);
        foreach (var p in estimate.Curve)
        {
            Row(csv, [I(p.SetEquivalents), I(p.PartsBought), R(p.MeanSets), I(p.Low), I(p.Median), I(p.High)]);
        }

        csv.Flush();
    }

    private static void Header(CsvWriter csv, string[] columns)
    {
        foreach (var c in columns)
        {
            csv.WriteField(c);
        }

        csv.EndRecord();
    }

    private static void Row(CsvWriter csv, string[] fields)
    {
        foreach (var f in fields)
        {
            SpreadsheetCsv.WriteCell(csv, f);
        }

        csv.EndRecord();
    }

    private static string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    private static string I(int x) => x.ToString(CultureInfo.InvariantCulture);

    private static string O(double? x) => x is { } v ? R(v) : "";
}
