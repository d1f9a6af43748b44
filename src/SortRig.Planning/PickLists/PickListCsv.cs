using System.Globalization;
using CsvHelper;

namespace SortRig.Planning.PickLists;

/// <summary>Writes a pick list as RFC 4180 CSV (CsvHelper; numbers in invariant culture): one row per item, with its set's outputs.</summary>
public static class PickListCsv
{
    /// <summary>Column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
        ["set", "position", "build", "part", "source", "nominal_ohm", "value_ohm", "set_score", "set_outputs"];

    /// <summary>Writes the list. The caller owns the writer.</summary>
    public static void Write(TextWriter writer, PickList list)
    {
        using var csv = CsvWriter.Create(writer, null, leaveOpen: true);
        foreach (var c in Columns)
        {
            csv.WriteField(c);
        }

        csv.EndRecord();
        foreach (var set in list.Sets)
        {
            var outputs = string.Join("; ", set.Outputs.Select(o => FormattableString.Invariant(
                $"{o.Name}={o.Value:G9} err={o.Error:G4} worst={o.WorstCaseError:G4} tol={o.Tolerance:G4} {o.Unit}")));
            foreach (var item in set.Items)
            {
                csv.WriteField(set.Number.ToString(CultureInfo.InvariantCulture));
                csv.WriteField(item.Position);
                csv.WriteField(item.Build);
                csv.WriteField(item.PartId?.ToString(CultureInfo.InvariantCulture) ?? "");
                csv.WriteField(item.Source);
                csv.WriteField(item.Nominal.ToString("R", CultureInfo.InvariantCulture));
                csv.WriteField(item.Value?.ToString("R", CultureInfo.InvariantCulture) ?? "");
                csv.WriteField(set.Score.ToString("F4", CultureInfo.InvariantCulture));
                csv.WriteField(outputs);
                csv.EndRecord();
            }
        }

        csv.Flush();
    }
}
