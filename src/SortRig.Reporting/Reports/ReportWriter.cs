using System.Text;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Measurement.Drift;
using SortRig.Measurement.Readings;
using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Reports;

/// <summary>
/// Writes a report folder: one histogram PNG per nominal, a drift and an ADEV PNG per drift channel,
/// parts.csv, drift_samples.csv, adev.csv and summary.md linking them.
/// </summary>
/// <param name="timeProvider">Clock for the "generated" line of summary.md.</param>
/// <param name="options">Plot size and summary choices; default <c>new ReportOptions()</c>.</param>
/// <param name="logger">Logger; default none.</param>
public sealed class ReportWriter(
    TimeProvider timeProvider,
    ReportOptions? options = null,
    ILogger<ReportWriter>? logger = null
)
{
    /// <summary>Name of the markdown summary in the report folder.</summary>
    public const string SummaryFileName = "summary.md";

    private readonly TimeProvider _timeProvider = timeProvider ?? throw new ArgumentNullException(nameof(timeProvider));
    private readonly ReportOptions _options = options ?? new ReportOptions();
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;

    /// <summary>Writes the report into <paramref name="folder"/> (created if missing; files of the same name are
    /// replaced).</summary>
    /// <param name="folder">Target folder.</param>
    /// <param name="input">Parts, reels and drift samples.</param>
    /// <param name="cancellationToken">Stops between files.</param>
    public async Task<ReportManifest> WriteAsync(
        string folder,
        ReportInput input,
        CancellationToken cancellationToken = default
    )
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(folder);
        ReportInputCheck.Validate(input);
        string root = Directory.CreateDirectory(folder).FullName;
        var files = new List<string>();

        async Task Save(string name, byte[] bytes)
        {
            await File.WriteAllBytesAsync(Path.Combine(root, name), bytes, cancellationToken).ConfigureAwait(false);
            files.Add(name);
        }

        var nominals = new List<NominalSummary>();
        foreach (IGrouping<double, ReportPart> reel in input.Parts.GroupBy(p => p.NominalOhms).OrderBy(g => g.Key))
        {
            ReportReel? stock = input.Reels.FirstOrDefault(r => r.NominalOhms.Equals(reel.Key));
            string name = $"histogram_{OhmsText.FileToken(reel.Key)}.png";
            var plot = ReelHistogramPlot.Render(
                new ReelHistogramInput(
                    reel.Key,
                    reel.Select(p => p.ValueOhms).ToArray(),
                    stock?.TolerancePercent,
                    stock?.CupEdgesPpm ?? []
                ),
                _options.PlotSize
            );
            await Save(name, plot.Png).ConfigureAwait(false);
            nominals.Add(Nominal(reel.Key, plot.Data.DeviationsPpm, stock?.TolerancePercent, name));
        }

        var channels = new List<ChannelSummary>();
        foreach (
            IGrouping<string, ReportDriftSample> group in input
                .DriftSamples.GroupBy(s => s.Channel, StringComparer.Ordinal)
                .OrderBy(g => g.Key, StringComparer.Ordinal)
        )
        {
            DriftSample[] samples = group
                .OrderBy(s => s.Time)
                .Select(s => new DriftSample(s.Time, s.Ohms, s.TemperatureC))
                .ToArray();
            string token = FileToken(group.Key);
            ChannelSummary summary = ChannelAnalysis.Analyze(
                group.Key,
                samples,
                $"drift_{token}.png",
                $"adev_{token}.png"
            );
            if (summary.JointNote is { } reason)
            {
                Log.NoJointFit(_logger, group.Key, reason);
            }

            var drift = DriftPlot.Render(
                new DriftPlotInput(group.Key, samples, summary.ReferenceOhms, summary.Drift),
                _options.PlotSize
            );
            await Save(summary.DriftPlotFile, drift.Png).ConfigureAwait(false);
            if (summary.AdevPlotFile is { } adevFile)
            {
                var adev = AllanPlot.Render(group.Key, summary.Adev, _options.AdevErrorBars, _options.PlotSize);
                await Save(adevFile, adev.Png).ConfigureAwait(false);
            }

            channels.Add(summary);
        }

        await WriteCsvAsync(root, input, channels, files, cancellationToken).ConfigureAwait(false);
        var cups = input
            .Parts.Where(p => p.Cup is not null)
            .GroupBy(p => p.Cup!, StringComparer.Ordinal)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => KeyValuePair.Create(g.Key, g.Count()))
            .ToArray();
        string summaryPath = Path.Combine(root, SummaryFileName);
        var manifest = new ReportManifest(root, summaryPath, files, nominals, channels, cups);
        string markdown = SummaryMarkdown.Build(
            input.Title,
            _timeProvider.GetUtcNow(),
            input.Parts.Count,
            manifest,
            _options.SummaryAveragingFactors,
            ReportPace.Line(input.Parts)
        );
        await File.WriteAllTextAsync(summaryPath, markdown, new UTF8Encoding(false), cancellationToken)
            .ConfigureAwait(false);
        files.Add(SummaryFileName);
        Log.ReportWritten(_logger, root, input.Parts.Count, channels.Count, files.Count);
        return manifest;
    }

    // A file only for what the report holds: a sorting session has no drift samples, a drift run may have no parts.
    private static async Task WriteCsvAsync(
        string root,
        ReportInput input,
        List<ChannelSummary> channels,
        List<string> files,
        CancellationToken ct
    )
    {
        if (input.Parts.Count > 0)
        {
            await CsvFiles
                .WriteAsync(
                    Path.Combine(root, "parts.csv"),
                    input.Parts.Select(p => new PartCsvRow(
                        p.Number,
                        p.NominalOhms,
                        p.ValueOhms,
                        ((p.ValueOhms / p.NominalOhms) - 1.0) * 1e6,
                        p.StandardUncertaintyOhms,
                        p.Cup ?? string.Empty
                    )),
                    ct
                )
                .ConfigureAwait(false);
            files.Add("parts.csv");
        }

        if (input.DriftSamples.Count > 0)
        {
            await CsvFiles
                .WriteAsync(
                    Path.Combine(root, "drift_samples.csv"),
                    input.DriftSamples.Select(s => new DriftCsvRow(s.Time, s.Channel, s.Ohms, s.TemperatureC)),
                    ct
                )
                .ConfigureAwait(false);
            files.Add("drift_samples.csv");
        }

        if (channels.Any(c => c.Adev.Count > 0))
        {
            await CsvFiles
                .WriteAsync(
                    Path.Combine(root, "adev.csv"),
                    channels.SelectMany(c =>
                        c.Adev.Select(p => new AdevCsvRow(
                            c.Channel,
                            p.AveragingFactor,
                            p.TauSeconds,
                            p.Deviation * 1e6,
                            p.Lower * 1e6,
                            p.Upper * 1e6,
                            p.TermCount,
                            p.DegreesOfFreedom
                        ))
                    ),
                    ct
                )
                .ConfigureAwait(false);
            files.Add("adev.csv");
        }
    }

    private static NominalSummary Nominal(double nominal, double[] ppm, double? tolerance, string file) =>
        new(
            nominal,
            ppm.Length,
            MathNet.Numerics.Statistics.Statistics.Mean(ppm),
            ppm.Length > 1 ? MathNet.Numerics.Statistics.Statistics.StandardDeviation(ppm) : double.NaN,
            ppm.Min(),
            ppm.Max(),
            tolerance,
            file
        );

    private static string FileToken(string channel) =>
        new(channel.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' ? c : '_').ToArray());
}
