using System.Globalization;
using CsvHelper;
using SortRig.Engine.Picking;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Reporting.Reports;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>The labels verb: plain labels for parts, as fixed-width text or as CSV for label software.</summary>
internal static class LibraryLabels
{
    /// <summary>CSV columns, in order (the *_text columns are rounded as on the text label).</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "id",
        "nominal_ohm",
        "value_ohm",
        "expanded_u_ohm",
        "k",
        "deviation_ppm",
        "temperature_c",
        "date",
        "location",
        "nominal_text",
        "value_text",
        "u_text",
    ];

    /// <param name="database">SQLite path or PostgreSQL connection string.</param>
    /// <param name="ids">Parts to label, in this order.</param>
    /// <param name="format">"text" (default) or "csv".</param>
    /// <param name="outPath">Output file, or null for <paramref name="stdout"/>.</param>
    /// <param name="console">Where messages go.</param>
    /// <param name="stdout">Where labels go without a file.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static Task<int> RunAsync(
        string database,
        IReadOnlyList<long> ids,
        string? format,
        string? outPath,
        IAnsiConsole console,
        TextWriter stdout,
        CancellationToken cancellationToken
    ) => VerbGuard.RunAsync(console, async () =>
        {
            var csv = (format ?? "text").Trim().ToLowerInvariant() switch
            {
                "text" => false,
                "csv" => true,
                _ => throw new VerbException($"--format: '{format}' is not text or csv"),
            };
            await using var log = await VerbGuard.OpenLogAsync(database, cancellationToken).ConfigureAwait(false);
            var parts = new List<PartRecord>();
            var unknown = new List<long>();
            foreach (var id in ids)
            {
                if (await log.GetPartAsync(id, cancellationToken).ConfigureAwait(false) is { } p)
                {
                    parts.Add(p);
                }
                else
                {
                    unknown.Add(id);
                }
            }

            if (unknown.Count > 0)
            {
                throw new VerbException($"unknown part ids: {string.Join(", ", unknown)} (no labels written)");
            }

            var qualify = parts.Select(p => p.SessionId).Distinct().Count() > 1;
            if (outPath is null)
            {
                Write(stdout, parts, csv, qualify);
                return VerbExit.Ok;
            }

            await using (var file = new StreamWriter(outPath, append: false))
            {
                Write(file, parts, csv, qualify);
            }

            console.MarkupLine(Markup.Escape($"{parts.Count} label(s) written to {outPath}"));
            return VerbExit.Ok;
        });

    /// <summary>Text: each label's lines, then one empty line. CSV: a header and one row per label.</summary>
    public static void Write(TextWriter writer, IReadOnlyList<PartRecord> parts, bool csv, bool qualify)
    {
        if (!csv)
        {
            foreach (var p in parts)
            {
                foreach (var line in PartLabel.Render(p, qualify))
                {
                    writer.Write(line + "\n");
                }

                writer.Write("\n");
            }

            writer.Flush();
            return;
        }

        using var w = CsvWriter.Create(writer, SpreadsheetCsv.Options, leaveOpen: true);
        foreach (var c in Columns)
        {
            w.WriteField(c);
        }

        w.EndRecord();
        foreach (var p in parts)
        {
            var (value, u) = UncertaintyRounding.Round(p.Value, p.Measured.Expanded);
            string[] fields =
            [
                p.Id.ToString(CultureInfo.InvariantCulture),
                R(p.Nominal),
                R(p.Value),
                R(p.Measured.Expanded),
                R(p.Measured.CoverageFactor),
                p.DeviationPpm.ToString("0.0", CultureInfo.InvariantCulture),
                Format.Celsius(p.Temperature),
                Format.Date(p.AcceptedAt),
                PartWhere.Of(p, qualify),
                OhmsText.Nominal(p.Nominal),
                value,
                u,
            ];
            foreach (var f in fields)
            {
                SpreadsheetCsv.WriteCell(w, f);
            }

            w.EndRecord();
        }

        w.Flush();
    }

    private static string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);
}
