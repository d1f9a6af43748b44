using CsvHelper;
using SortRig.Reporting.Reports;

namespace SortRig.Reporting.Tests.Reports;

public sealed class SpreadsheetCsvTests
{
    // CSV injection: cells starting with =, +, -, @, tab or CR are run as formulas by spreadsheets; the advice is
    // a leading apostrophe (OWASP "CSV Injection", from memory). Numbers formatted as text stay numbers.
    [Theory]
    [InlineData(
        "=HYPERLINK(\"http://example.invalid\",\"click\")",
        "'=HYPERLINK(\"http://example.invalid\",\"click\")"
    )]
    [InlineData("@bag 7", "'@bag 7")]
    [InlineData("+cmd", "'+cmd")]
    [InlineData("-x", "'-x")]
    [InlineData("\rtext", "'\rtext")]
    [InlineData("drawer 3", "drawer 3")]
    [InlineData("-321.0", "-321.0")]
    [InlineData("+5", "5")]
    [InlineData("12", "12")]
    [InlineData("1E-06", "1E-06")]
    [InlineData("", "")]
    public void WriteCell_TextNeutralised_NumbersKept(string cell, string expected)
    {
        var text = new StringWriter();
        using (var csv = CsvWriter.Create(text, SpreadsheetCsv.Options, leaveOpen: true))
        {
            csv.WriteField("h");
            csv.EndRecord();
            SpreadsheetCsv.WriteCell(csv, cell);
            csv.EndRecord();
            csv.Flush();
        }

        using var reader = CsvReader.FromText(text.ToString(), null);
        Assert.True(reader.Read());
        Assert.Equal(expected, reader.GetString("h"));
    }
}
