using CsvHelper;
using SortRig.Host.VerbSupport;
using SortRig.Reporting.Plots;
using SortRig.Reporting.Reports;
using SortRig.Storage;

namespace SortRig.Host.ReportVerb;

/// <summary>
/// The report verb's work: opens the log, maps the session and/or drift run to a <see cref="ReportInput"/>,
/// writes the folder with <see cref="ReportWriter"/> (PNGs, CSV, summary.md) and, beside each histogram,
/// the bin counts it shows (histogram_&lt;nominal&gt;_bins.csv).
/// </summary>
internal static class ReportRunner
{
    /// <summary>Writes the report; returns the folder, the files and notes.</summary>
    /// <exception cref="ArgumentException">Bad request, or no such session or run.</exception>
    public static async Task<ReportResult> RunAsync(
        ReportRequest request,
        TimeProvider time,
        ReportOptions? options,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        options ??= new ReportOptions();
        VerbGuard.RequireExisting(request.Database);
        ReportFolderGuard.Check(request.Output, request.Force);
        await using var log = await PrecisionLogFactory
            .OpenAsync(request.Database, new PrecisionLogOptions { TimeProvider = time }, ct)
            .ConfigureAwait(false);
        var (input, notes) = await ReportInputBuilder.BuildAsync(log, request, ct).ConfigureAwait(false);
        var manifest = await new ReportWriter(time, options)
            .WriteAsync(request.Output, input, ct)
            .ConfigureAwait(false);
        var files = manifest.Files.ToList();
        foreach (var nominal in manifest.Nominals)
        {
            // Same input as the writer's histogram, so the bins are exactly those drawn.
            var reel = input.Reels.FirstOrDefault(r => r.NominalOhms.Equals(nominal.NominalOhms));
            var values = input
                .Parts.Where(p => p.NominalOhms.Equals(nominal.NominalOhms))
                .Select(p => p.ValueOhms)
                .ToArray();
            var data = ReelHistogramPlot
                .Render(
                    new ReelHistogramInput(
                        nominal.NominalOhms,
                        values,
                        reel?.TolerancePercent,
                        reel?.CupEdgesPpm ?? []
                    ),
                    options.PlotSize
                )
                .Data;
            var name = Path.ChangeExtension(nominal.HistogramFile, null) + "_bins.csv";
            var rows = data.Counts.Select(
                (c, i) => new HistogramBinCsvRow(nominal.NominalOhms, data.BinEdgesPpm[i], data.BinEdgesPpm[i + 1], c)
            );
            var writer = CsvWriter.ToFile(
                Path.Combine(manifest.Folder, name),
                SpreadsheetCsv.Options,
                FileOptions.Asynchronous
            );
            await using (writer.ConfigureAwait(false))
            {
                await writer.WriteRecordsAsync(rows, ct).ConfigureAwait(false);
                await writer.FlushAsync(ct).ConfigureAwait(false);
            }

            files.Add(name);
        }

        if (!string.IsNullOrWhiteSpace(request.Session))
        {
            var more = notes.ToList();
            files.AddRange(
                await CheckReport
                    .WriteAsync(log, request.Session, manifest.Folder, options.PlotSize, more, ct)
                    .ConfigureAwait(false)
            );
            notes = more;
        }

        return new ReportResult(manifest.Folder, files, notes);
    }
}
