using System.Globalization;
using SortRig.Engine.Announcing;
using SortRig.Engine.Events;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // Opens or resumes the session: numbering and cup counts continue from the log, and a part
    // committed but never announced (a crash in between) is announced again before anything else.
    private async Task OpenSessionAsync(CancellationToken ct)
    {
        var log = _ctx.Log;
        var state = await log.OpenOrResumeSessionAsync(
                new SessionRequest(Options.Session, ReopenFinished: Options.Reopen),
                ct
            )
            .ConfigureAwait(false);
        _session = state.Session;
        var setup = new BatchSetup(
            Options.Nominal,
            Options.StockTolerance * 1e6,
            Options.MatchTolerance * 1e6,
            _ctx.Plan.Range,
            _ctx.Plan.Nplc,
            Options.FourWire,
            _ctx.Plan.Meter.Family,
            _meter.Identity
        );
        _batch =
            state.CurrentBatch is { } current && SameBatch(current.Setup, setup)
                ? current
                : await log.StartBatchAsync(_session.Id, setup, ct).ConfigureAwait(false);
        // The same reel goes on: the settle rule keeps what its parts taught it (a new batch learns afresh).
        if (_batch.ReelPrior is { } learned)
        {
            _tracker.Prior = learned;
        }

        var parts = await log.GetPartsAsync(_session.Id, ct).ConfigureAwait(false);
        LoadExtraNumbers(parts);
        _partsRecorded = parts.Count - _extraPositions.Count;
        var history = parts
            .Where(p => p.IsLive && (p.CupLabel ?? p.SlotLabel) is not null)
            .Select(p => (new CupRequest(p.Number, p.Nominal, p.Measured), (p.CupLabel ?? p.SlotLabel)!))
            .ToList();
        _ctx.Cups.Restore(history);
        foreach (var p in parts)
        {
            _ctx.Snapshot.Upsert(ToView(p));
        }

        _lastLive = parts.Where(p => p.IsLive).OrderBy(p => p.Number).LastOrDefault();
        _ctx.Snapshot.SetSession(
            new SessionView(
                _session.Name,
                _session.Id,
                Options.Nominal,
                Options.StockTolerance,
                Options.MatchTolerance,
                _meter.Identity,
                FormattableString.Invariant($"{_ctx.Plan.Range:G6} Ohm"),
                _ctx.Plan.Nplc,
                PlannedParts,
                false,
                false
            )
        );
        PublishCounts();

        if (state.Resumed)
        {
            await _ctx
                .Announcer.AnnounceAsync(
                    Announcement.Info($"resuming session '{_session.Name}' at part {state.NextPartNumber}"),
                    ct
                )
                .ConfigureAwait(false);
        }

        foreach (var p in state.Unannounced.OrderBy(p => p.Number))
        {
            await AnnounceStoredAsync(p, AnnouncementKind.Repeat, completesSet: false, ct).ConfigureAwait(false);
        }

        await ResolveBuildTargetAsync(state.Resumed, ct).ConfigureAwait(false);
        await CheckBuildAsync(null, ct).ConfigureAwait(false);
        if (!SetsComplete)
        {
            await PrepareRangeTransferAsync(state.Batches, ct).ConfigureAwait(false);
        }

        await PrepareCheckAsync(ct).ConfigureAwait(false);
        _ctx.Hands.ResumeAt(_partsRecorded);
    }

    // The meter is set up and the session open: tell the operator to put the next part in.
    private async Task AnnounceReadyAsync(CancellationToken ct)
    {
        if (!Done)
        {
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"ready: {Options.Nominal:G6} Ohm on the {_ctx.Plan.Range:G6} Ohm range at NPLC "
                            + $"{_ctx.Plan.Nplc:G4}; put part {_partsRecorded + 1} in the fixture"
                    ),
                    ct
                )
                .ConfigureAwait(false);
        }

        _ctx.Hands.Ready();
    }

    private static bool SameBatch(BatchSetup a, BatchSetup b) =>
        a.Nominal == b.Nominal
        && a.Range == b.Range
        && a.Nplc == b.Nplc
        && a.FourWire == b.FourWire
        && a.MatchTolerancePpm == b.MatchTolerancePpm
        && a.StockTolerancePpm == b.StockTolerancePpm;

    private void PublishCounts()
    {
        var counts = _ctx.Cups.Counts.ToDictionary(c => c.CupLabel, c => c.Count, StringComparer.Ordinal);
        _ctx.Snapshot.SetCounts(counts);
        _ctx.Hub.Publish(new BenchEvent(0, BenchEventKind.Counts, default, Counts: counts));
    }

    private static PartView ToView(PartRecord p) =>
        new(
            p.Number,
            p.Nominal,
            p.Value,
            p.DeviationPpm,
            p.Measured.ExpandedTransfer,
            p.CupLabel ?? p.SlotLabel,
            p.State.ToString(),
            p.AcceptedAt,
            p.AcceptedBy?.ToString()
        );
}
