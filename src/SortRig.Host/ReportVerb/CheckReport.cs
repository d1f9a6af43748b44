using System.Globalization;
using System.Text;
using SortRig.Engine.Composition;
using SortRig.Measurement.Control;
using SortRig.Reporting.Plots;
using SortRig.Storage.Contracts;

namespace SortRig.Host.ReportVerb;

/// <summary>
/// The check standard in the report (docs/checking.md): the session's control chart as check_chart.png, and
/// meter_health.md: the apparent meter gain of every session that read the same check, with a warning when the
/// meter moved more than its profile's one-year specification allows. Nothing when the session read no check.
/// </summary>
internal static class CheckReport
{
    public static async Task<IReadOnlyList<string>> WriteAsync(
        IPrecisionLog log,
        string sessionNameOrId,
        string folder,
        PlotSize size,
        List<string> notes,
        CancellationToken ct
    )
    {
        var session = await ReportInputBuilder.FindSessionAsync(log, sessionNameOrId, ct).ConfigureAwait(false);
        var checks = await log.GetSessionChecksAsync(session.Id, ct).ConfigureAwait(false);
        var judged = checks.Where(c => c.Commit.CentreOhms is not null && c.Commit.SigmaOhms is > 0).ToList();
        if (judged.Count == 0)
        {
            return [];
        }

        var files = new List<string>();
        var last = judged[^1].Commit;
        var chart = ControlChartPlot.Render(
            new ControlChartInput(
                last.CheckName,
                [.. judged.Select(c => c.Commit.ScaledOhms)],
                [.. judged.Select(c => !c.Commit.InControl)],
                last.CentreOhms!.Value,
                last.SigmaOhms!.Value
            ),
            size
        );
        await File.WriteAllBytesAsync(Path.Combine(folder, "check_chart.png"), chart.Png, ct).ConfigureAwait(false);
        files.Add("check_chart.png");
        if (await HealthAsync(log, session, last, ct).ConfigureAwait(false) is { } md)
        {
            await File.WriteAllTextAsync(Path.Combine(folder, "meter_health.md"), md, ct).ConfigureAwait(false);
            files.Add("meter_health.md");
        }
        else
        {
            notes.Add($"check {last.CheckName} has no calibrated value (--check-value): no meter-health table");
        }

        return files;
    }

    private static async Task<string?> HealthAsync(
        IPrecisionLog log,
        SessionInfo session,
        CheckCommit last,
        CancellationToken ct
    )
    {
        var history = await log.GetCheckHistoryAsync(last.CheckName, 100_000, ct).ConfigureAwait(false);
        var sessions = (await log.ListSessionsAsync(ct).ConfigureAwait(false)).ToDictionary(s => s.Id);
        var gains = history
            // Before any re-reference: the meter as it is.
            .Where(c => c.GainPpm is not null && c.Commit.ScaleFactor == 1)
            .GroupBy(c => c.Commit.SessionId)
            .Select(g => new SessionGain(
                sessions.TryGetValue(g.Key, out var s) ? s.Name : g.Key.ToString(CultureInfo.InvariantCulture),
                g.Min(c => c.Commit.At),
                g.Average(c => c.GainPpm!.Value),
                g.Count()
            ))
            .ToList();
        if (gains.Count == 0)
        {
            return null;
        }

        var batches = await log.GetBatchesAsync(session.Id, ct).ConfigureAwait(false);
        var family = batches.Count > 0 ? batches[^1].Setup.MeterFamily : "simulator";
        var range = ProfileLocator.Load(family).FindRange(last.RangeOhms);
        var allowed = range is null
            ? double.PositiveInfinity
            : MeterHealth.AllowedPpm(
                range.Accuracy1Year.PercentOfReading,
                range.Accuracy1Year.PercentOfRange,
                last.RangeOhms,
                last.CalibratedOhms ?? last.ValueOhms
            );
        var rows = double.IsFinite(allowed) ? MeterHealth.Judge(gains, allowed) : [];
        var md = new StringBuilder();
        md.AppendLine(CultureInfo.InvariantCulture, $"# Meter health: check {last.CheckName}");
        md.AppendLine();
        md.AppendLine(
            CultureInfo.InvariantCulture,
            $"Apparent gain = mean of (reading / calibrated - 1) per session; allowed movement {allowed:0.0} ppm "
        );
        md.AppendLine(
            CultureInfo.InvariantCulture,
            $"(profile '{family}', one-year specification on the {last.RangeOhms:G6} Ohm range)."
        );
        md.AppendLine();
        md.AppendLine("| Session | First check (UTC) | Checks | Gain (ppm) | Moved (ppm) | Health |");
        md.AppendLine("| --- | --- | --- | --- | --- | --- |");
        foreach (var r in rows)
        {
            md.Append(
                CultureInfo.InvariantCulture,
                $"| {r.Gain.Session} | {r.Gain.At:yyyy-MM-dd HH:mm} | {r.Gain.Checks} | {r.Gain.GainPpm:+0.0;-0.0} | "
            );
            md.AppendLine(CultureInfo.InvariantCulture, $"{r.MovedPpm:+0.0;-0.0} | {r.Warning ?? "ok"} |");
        }

        return md.ToString();
    }
}
