using System.Globalization;
using CsvHelper;
using SortRig.Engine.Picking;
using SortRig.Host.VerbSupport;
using SortRig.Reporting.Reports;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>The export verb: every live part of the library as RFC 4180 CSV (CsvHelper, invariant culture), with what
/// its latest drift run showed (empty drift fields for parts never logged).</summary>
internal static class LibraryExport
{
    /// <summary>Column names, in order.</summary>
    public static IReadOnlyList<string> Columns { get; } =
    [
        "id",
        "session_id",
        "session",
        "number",
        "nominal_ohm",
        "value_ohm",
        "deviation_ppm",
        "u_ohm",
        "u_transfer_ohm",
        "k",
        "expanded_u_ohm",
        "range_ohm",
        "nplc",
        "temperature_c",
        "accepted_at",
        "cup",
        "slot",
        "location",
        "status",
        "taken_by",
        "drift_run_id",
        "drift_run",
        "drift_hours",
        "drift_ppm_h",
        "tempco_ppm_k",
        "adev_tau_s",
        "adev_ppm",
    ];

    /// <param name="database">SQLite path or PostgreSQL connection string.</param>
    /// <param name="csvPath">Output file, or "-" for <paramref name="stdout"/>.</param>
    /// <param name="status">available, taken, used, retired or any (default).</param>
    /// <param name="nominal">Only this nominal ("10k"), or null for all.</param>
    /// <param name="console">Where messages go.</param>
    /// <param name="stdout">Where "-" writes.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static Task<int> RunAsync(
        string database,
        string csvPath,
        string? status,
        string? nominal,
        IAnsiConsole console,
        TextWriter stdout,
        CancellationToken cancellationToken
    ) => VerbGuard.RunAsync(console, async () =>
        {
            var query = new LibraryQuery(
                OhmsArg.ParseOptional(nominal, "--nominal"),
                Status: StatusArg.Parse(status ?? "any"),
                Limit: 100_000
            );
            await using var log = await VerbGuard.OpenLogAsync(database, cancellationToken).ConfigureAwait(false);
            var parts = await log.FindPartsAsync(query, cancellationToken).ConfigureAwait(false);
            var sessions = (await log.ListSessionsAsync(cancellationToken).ConfigureAwait(false)).ToDictionary(
                s => s.Id,
                s => s.Name
            );
            var ordered = parts.OrderBy(p => p.Id).ToList();
            var drift = await LibraryDrift.LatestAsync(log, ordered, cancellationToken).ConfigureAwait(false);
            if (csvPath == "-")
            {
                Write(stdout, ordered, sessions, drift);
                return VerbExit.Ok;
            }

            await using (var file = new StreamWriter(csvPath, append: false))
            {
                Write(file, ordered, sessions, drift);
            }

            console.MarkupLine(
                Markup.Escape($"{ordered.Count} part(s) written to {csvPath}")
                    + (parts.Count == query.Limit ? " [yellow](the limit: filter by --nominal or --status)[/]" : "")
            );
            return VerbExit.Ok;
        });

    public static void Write(
        TextWriter writer,
        IReadOnlyList<PartRecord> parts,
        IReadOnlyDictionary<long, string> sessions,
        IReadOnlyDictionary<long, PartDrift> drift
    )
    {
        using var csv = CsvWriter.Create(writer, SpreadsheetCsv.Options, leaveOpen: true);
        foreach (var c in Columns)
        {
            csv.WriteField(c);
        }

        csv.EndRecord();
        foreach (var p in parts)
        {
            var m = p.Measured;
            string[] fields =
            [
                I(p.Id),
                I(p.SessionId),
                sessions.GetValueOrDefault(p.SessionId, ""),
                I(p.Number),
                R(p.Nominal),
                R(p.Value),
                R(p.DeviationPpm),
                R(m.StandardUncertainty),
                R(m.TransferUncertainty),
                R(m.CoverageFactor),
                R(m.Expanded),
                R(p.Range),
                R(p.Nplc),
                p.Temperature is { } t ? R(t) : "",
                p.AcceptedAt.UtcDateTime.ToString("yyyy-MM-ddTHH:mm:ss.ffffffZ", CultureInfo.InvariantCulture),
                PartWhere.CupOf(p) ?? "",
                PartWhere.SlotOf(p) ?? "",
                p.Location ?? "",
                p.LibraryStatus.ToString(),
                p.TakenBy ?? "",
                .. DriftFields(drift.GetValueOrDefault(p.Id)),
            ];
            foreach (var f in fields)
            {
                SpreadsheetCsv.WriteCell(csv, f);
            }

            csv.EndRecord();
        }

        csv.Flush();
    }

    /// <summary>The drift columns: run id and name, hours, ppm/h, ppm/K, tau in s and ADEV in ppm; empty when not
    /// known.</summary>
    private static string[] DriftFields(PartDrift? d) =>
        d is null
            ? ["", "", "", "", "", "", ""]
            :
            [
                I(d.RunId),
                d.RunName,
                R(d.HoursLogged),
                O(d.PpmPerHour),
                O(d.TempcoPpmPerKelvin),
                O(d.Adev?.TauSeconds),
                O(d.Adev?.Deviation * 1e6),
            ];

    private static string O(double? x) => x is { } v ? R(v) : "";

    private static string I(long x) => x.ToString(CultureInfo.InvariantCulture);

    private static string R(double x) => x.ToString("R", CultureInfo.InvariantCulture);
}
