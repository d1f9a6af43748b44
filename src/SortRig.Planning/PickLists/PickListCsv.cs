using System.Globalization;
using CsvHelper;

namespace SortRig.Planning.PickLists;

/// <summary>
/// Writes a pick list as RFC 4180 CSV (CsvHelper; numbers in invariant culture): one row per item, with its set's
/// outputs. Text cells that a spreadsheet would run as a formula (leading =, +, -, @, tab, CR) get a leading
/// apostrophe, the rule of every SortRig CSV (docs/storage.md); numbers are written as numbers.
/// </summary>
public static class PickListCsv
{
    /// <summary>Column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    ["set", "position", "build", "part", "source", "nominal_ohm", "value_ohm", "set_score", "set_outputs"];

    private static readonly CsvWriterOptions s_options = new() { Injection = CsvInjection.Escape };

    /// <summary>Writes the list. The caller owns the writer.</summary>
    public static void Write(TextWriter writer, PickList list)
    {
        using var csv = CsvWriter.Create(writer, s_options, leaveOpen: true);
        foreach (var c in Columns)
        {
            csv.WriteField(c);
        }

        csv.EndRecord();
        foreach (var set in list.Sets)
        {
            var outputs = string.Join(
                "; ",
                set.Outputs.Select(o =>
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"{o.Name}={o.Value:G9} err={o.Error:G4} worst={o.WorstCaseError:G4} tol={o.Tolerance:G4} "
                            + $"{o.Unit}"
                    )
                )
            );
            foreach (var item in set.Items)
            {
                csv.WriteField(set.Number, "D", CultureInfo.InvariantCulture);
                csv.WriteField(item.Position);
                csv.WriteField(item.Build);
                csv.WriteField(item.PartId, "D");
                csv.WriteField(item.Source);
                csv.WriteField(item.Nominal, "R", CultureInfo.InvariantCulture);
                csv.WriteField(item.Value, "R");
                csv.WriteField(set.Score, "F4", CultureInfo.InvariantCulture);
                csv.WriteField(outputs);
                csv.EndRecord();
            }
        }

        csv.Flush();
    }
}
