using CsvHelper;

namespace SortRig.Reporting.Reports;

/// <summary>Report CSV files through CsvHelper: comma separated, header row, invariant culture, UTF-8 without BOM,
/// formula cells neutralised (SpreadsheetCsv).</summary>
internal static class CsvFiles
{
    public static async Task WriteAsync<T>(string path, IEnumerable<T> rows, CancellationToken cancellationToken)
    {
        CsvWriter writer = CsvWriter.ToFile(path, SpreadsheetCsv.Options, FileOptions.Asynchronous);
        await using (writer.ConfigureAwait(false))
        {
            await writer.WriteRecordsAsync(rows, cancellationToken).ConfigureAwait(false);
            await writer.FlushAsync(cancellationToken).ConfigureAwait(false);
        }
    }
}
