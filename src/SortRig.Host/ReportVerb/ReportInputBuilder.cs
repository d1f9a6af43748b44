using System.Globalization;
using SortRig.Engine.DriftLogging;
using SortRig.Planning.Cups;
using SortRig.Reporting.Reports;
using SortRig.Storage.Contracts;

namespace SortRig.Host.ReportVerb;

/// <summary>Maps stored rows (sessions, batches, parts, drift samples) to the Reporting layer's <see
/// cref="ReportInput"/>.</summary>
internal static class ReportInputBuilder
{
    public static async Task<(ReportInput Input, IReadOnlyList<string> Notes)> BuildAsync(
        IPrecisionLog log,
        ReportRequest request,
        CancellationToken ct
    )
    {
        var notes = new List<string>();
        var titles = new List<string>();
        IReadOnlyList<ReportPart> parts = [];
        IReadOnlyList<ReportReel> reels = [];
        if (!string.IsNullOrWhiteSpace(request.Session))
        {
            var session = await FindSessionAsync(log, request.Session, ct).ConfigureAwait(false);
            titles.Add($"session '{session.Name}' (id {session.Id})");
            var live = (await log.GetPartsAsync(session.Id, ct).ConfigureAwait(false)).Where(p => p.IsLive).ToList();
            parts =
            [
                .. live.Select(p => new ReportPart(
                    p.Number,
                    p.Nominal,
                    p.Value,
                    p.Measured.StandardUncertainty,
                    p.CupLabel ?? p.SlotLabel,
                    p.AcceptedAt,
                    p.AcceptedBy?.ToString()
                )),
            ];
            reels = await ReelsAsync(log, session.Id, live, request.Cups, notes, ct).ConfigureAwait(false);
        }

        var drift = new List<ReportDriftSample>();
        if (request.DriftRunId is { } runId)
        {
            var run = await log.GetDriftRunAsync(runId, ct).ConfigureAwait(false)
                ?? throw new ArgumentException(
                    $"--drift-run: no drift run with id {runId} in "
                        + $"{SortRig.Storage.Lab.ConnectionText.Mask(request.Database)}.",
                    nameof(request)
                );
            titles.Add($"drift run '{run.Name}' (id {run.Id})");
            var labels = run.Channels.Select(c => c.Label).ToArray();
            await foreach (var s in log.ReadDriftSamplesAsync(runId, ct).ConfigureAwait(false))
            {
                // The Pt100's own resistance is not a drift channel: its temperature is on every part sample.
                if (!DriftSettings.IsPt100Label(labels[s.Channel]))
                {
                    drift.Add(new ReportDriftSample(s.Time, labels[s.Channel], s.Ohms, s.Temperature));
                }
            }

            var gaps = await log.GetDriftGapsAsync(runId, ct).ConfigureAwait(false);
            notes.AddRange(gaps.Select(g => $"gap {g.From:O} .. {g.To:O}: {g.Reason}"));
        }

        return (new ReportInput("SortRig report: " + string.Join(", ", titles), parts, reels, drift), notes);
    }

    internal static async Task<SessionInfo> FindSessionAsync(ISessionReader log, string nameOrId, CancellationToken ct)
    {
        var sessions = await log.ListSessionsAsync(ct).ConfigureAwait(false);
        var byId = long.TryParse(nameOrId, NumberStyles.None, CultureInfo.InvariantCulture, out var id)
            ? sessions.FirstOrDefault(s => s.Id == id)
            : null;
        var known =
            sessions.Count == 0 ? "none" : string.Join(", ", sessions.Take(10).Select(s => $"'{s.Name}' ({s.Id})"));
        return byId
            ?? sessions.FirstOrDefault(s => s.Name == nameOrId)
            ?? throw new ArgumentException(
                $"--session: no session named or numbered '{nameOrId}'; sessions are {known}.",
                nameof(nameOrId)
            );
    }

    private static async Task<IReadOnlyList<ReportReel>> ReelsAsync(
        IPrecisionLog log,
        long sessionId,
        IReadOnlyList<PartRecord> parts,
        int? cups,
        List<string> notes,
        CancellationToken ct
    )
    {
        var batches = await log.GetBatchesAsync(sessionId, ct).ConfigureAwait(false);
        var reels = new List<ReportReel>();
        foreach (var batch in batches.GroupBy(b => b.Setup.Nominal).Select(g => g.First()))
        {
            var nominal = batch.Setup.Nominal;
            var match = batch.Setup.MatchTolerancePpm;
            var k = cups
                ?? CupEdgeInference.InferCupCount(
                    parts.Where(p => p.Nominal.Equals(nominal)).Select(p => (p.DeviationPpm, p.CupLabel)),
                    match
                );
            if (k is null)
            {
                notes.Add(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"{nominal} ohm: no fixed-band cup count fits the recorded cups; band edges not drawn (give "
                            + $"--cups)"
                    )
                );
            }

            reels.Add(
                new ReportReel(
                    nominal,
                    batch.Setup.StockTolerancePpm / 1e4,
                    k is { } n ? CupEdgeInference.Edges(n, match) : []
                )
            );
        }

        return reels;
    }
}
