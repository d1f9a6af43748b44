using System.Globalization;
using CsvHelper;

namespace SortRig.Reporting.Reports;

/// <summary>
/// The options of every CSV file SortRig writes (reports, library export and labels; the pick list
/// writer in SortRig.Planning follows the same rule): RFC 4180, invariant culture, and a text cell that
/// starts with <c>=</c>, <c>+</c>, <c>-</c>, <c>@</c>, tab or CR gets a leading apostrophe, so a
/// spreadsheet shows it as text instead of running it as a formula (CsvHelper's
/// <see cref="CsvInjection.Escape"/>, the OWASP advice on CSV injection). Numbers are written as
/// numbers and never escaped (-321 stays -321). The database keeps the raw text.
/// </summary>
public static class SpreadsheetCsv
{
    /// <summary>RFC 4180 with formula cells neutralised.</summary>
    public static CsvWriterOptions Options { get; } = new() { Injection = CsvInjection.Escape };

    /// <summary>
    /// Writes a cell that was formatted as text already: a number (invariant culture, e.g. "-321.0", "1E-06") as
    /// the number it is, with the same decimals, anything else as text, neutralised when it could run as a formula.
    /// </summary>
    public static void WriteCell(CsvWriter csv, string text)
    {
        ArgumentNullException.ThrowIfNull(csv);
        ArgumentNullException.ThrowIfNull(text);
        if (text.Length > 0 && double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var number))
        {
            var dot = text.IndexOf('.', StringComparison.Ordinal);
            var format =
                text.AsSpan().IndexOfAny('e', 'E') >= 0 ? "R"
                : dot < 0 ? "F0"
                : "F" + (text.Length - dot - 1);
            csv.WriteField(number, format);
        }
        else
        {
            csv.WriteField(text);
        }
    }
}
