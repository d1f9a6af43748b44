using System.Globalization;
using SortRig.Engine.Picking;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>The find verb: parts by nominal, deviation window, status and location, as a table.</summary>
internal static class LibraryFind
{
    public static Task<int> RunAsync(FindRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            if (request.MinPpm > request.MaxPpm)
            {
                throw new VerbException($"--min-ppm {request.MinPpm} is above --max-ppm {request.MaxPpm}");
            }

            var query = new LibraryQuery(
                OhmsArg.ParseOptional(request.Nominal, "--nominal"),
                request.MinPpm,
                request.MaxPpm,
                StatusArg.Parse(request.Status),
                request.Location,
                request.Limit
            );
            await using var log = await VerbGuard
                .OpenLogAsync(request.Database, cancellationToken)
                .ConfigureAwait(false);
            var parts = await log.FindPartsAsync(query, cancellationToken).ConfigureAwait(false);
            var drift = await LibraryDrift.LatestAsync(log, parts, cancellationToken).ConfigureAwait(false);
            console.Write(Table(parts, drift));
            console.MarkupLine(
                parts.Count == request.Limit
                    ? $"[yellow]{parts.Count} parts (the limit): narrow the search or raise --limit.[/]"
                    : $"{parts.Count} part(s)."
            );
            return VerbExit.Ok;
        });

    /// <summary>One row per part: id, nominal, value and U (k = 2 unless marked), deviation, date, where, status and
    /// the drift of its latest drift run ("—" when never logged). The export has every field.</summary>
    public static Table Table(IReadOnlyList<PartRecord> parts, IReadOnlyDictionary<long, PartDrift> drift)
    {
        var table = new Table().NoBorder();
        foreach (
            var c in new[] { "id", "nominal", "value Ohm", "U Ohm", "dev ppm", "accepted", "where", "status", "drift" }
        )
        {
            table.AddColumn(new TableColumn(c).Padding(0, 0, 1, 0));
        }

        foreach (var p in parts)
        {
            var (value, u) = UncertaintyRounding.Round(p.Value, p.Measured.Expanded);
            var k =
                p.Measured.CoverageFactor == 2
                    ? ""
                    : " (k=" + p.Measured.CoverageFactor.ToString("0.##", CultureInfo.InvariantCulture) + ")";
            table.AddRow(
                p.Id.ToString(CultureInfo.InvariantCulture),
                Markup.Escape(OhmsText.Nominal(p.Nominal)),
                value,
                u + k,
                Format.Ppm(p.DeviationPpm),
                Format.Date(p.AcceptedAt),
                Markup.Escape(PartWhere.Of(p, qualify: true)),
                Markup.Escape(p.LibraryStatus + (p.TakenBy is { } by ? " " + by : "")),
                Format.DriftRate(drift.GetValueOrDefault(p.Id)?.PpmPerHour)
            );
        }

        return table;
    }
}
