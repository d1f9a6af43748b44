using SortRig.Engine.Announcing;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private async Task AcceptAsync(SettleAcceptance acceptance, CancellationToken ct)
    {
        // A meter reset to its defaults mid-part would have changed range or NPLC under us: check
        // before trusting the window, re-apply the setup and measure the part again.
        if (!await VerifySetupAsync(ct).ConfigureAwait(false))
        {
            _tracker.Remeasure();
            return;
        }

        CrashPoint.Pass(CrashSite.Read);
        var number = NextNumber;
        var measured = OnReferenceScale(acceptance.Value);
        var decision = _ctx.Cups.Assign(new CupRequest(number, Options.Nominal, measured));
        var commit = new PartCommit(
            Guid.NewGuid(),
            _session.Id,
            _batch.Id,
            measured,
            _ctx.Plan.Range,
            _ctx.Plan.Nplc,
            null,
            acceptance.Readings[^1].Time,
            decision.IsSlot ? null : decision.CupLabel,
            decision.IsSlot ? decision.CupLabel : null,
            [.. _partReadings],
            PartState.Accepted,
            acceptance.AcceptedBy,
            acceptance.AcceptedBy == SettleRule.Predictive ? acceptance.Fit : null,
            _ctx.Plan.Settle.Predictive is null ? null : _tracker.Prior
        );
        PartRecord stored;
        try
        {
            stored = await DurablyAsync($"part {number}", c => _ctx.Log.CommitPartAsync(commit, c), ct)
                .ConfigureAwait(false);
        }
        catch
        {
            _ctx.Cups.Undo(number);
            throw;
        }

        CrashPoint.Pass(CrashSite.Commit);
        _partsRecorded++;
        _lastLive = stored;
        _lastLiveStillInFixture = true;
        var kind = decision.IsReject ? AnnouncementKind.Reject : AnnouncementKind.Cup;
        await AnnounceStoredAsync(stored, kind, decision.CompletesSet, ct).ConfigureAwait(false);
        PublishCounts();
        await CheckBuildAsync(stored, ct).ConfigureAwait(false);
        _ctx.Hands.PartAnnounced();
    }

    private async Task RecordUnstableAsync(SettleFailure failure, CancellationToken ct)
    {
        var finite = _partReadings.Where(r => r.IsFinite).Select(r => r.Value).ToArray();
        var mean = finite.Length > 0 ? finite.Average() : 0;
        var spread = finite.Length > 1 ? MathNet.Numerics.Statistics.Statistics.StandardDeviation(finite) : 0;
        var commit = new PartCommit(
            Guid.NewGuid(),
            _session.Id,
            _batch.Id,
            new MeasuredValue(mean, spread, spread),
            _ctx.Plan.Range,
            _ctx.Plan.Nplc,
            null,
            _ctx.Time.GetUtcNow(),
            null,
            null,
            [.. _partReadings],
            PartState.Unstable
        );
        var stored = await DurablyAsync($"part {_partsRecorded + 1}", c => _ctx.Log.CommitPartAsync(commit, c), ct)
            .ConfigureAwait(false);
        _partsRecorded++;
        _unstable++;
        _ctx.Snapshot.Upsert(ToView(stored));
        var why = failure.Reason switch
        {
            UnstableReason.IntermittentContact => "intermittent contact: reseat the part or clean the clips",
            UnstableReason.DriftingSlope => "still drifting: set it aside to cool, then measure again",
            UnstableReason.NoisySem => "too noisy: check the contact and the leads",
            _ => "too few readings: check the contact",
        };
        await _ctx
            .Announcer.AnnounceAsync(
                new Announcement(AnnouncementKind.Unstable, stored.Number, "", mean, double.NaN, why),
                ct
            )
            .ConfigureAwait(false);
        await DurablyAsync(
                $"the announcement of part {stored.Number}",
                c => _ctx.Log.MarkAnnouncedAsync(stored.Id, c),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Hands.PartAnnounced();
    }

    private async Task AnnounceStoredAsync(
        PartRecord part,
        AnnouncementKind kind,
        bool completesSet,
        CancellationToken ct
    )
    {
        var label = part.CupLabel ?? part.SlotLabel ?? "";
        if (kind == AnnouncementKind.Repeat && label.Length == 0)
        {
            kind = AnnouncementKind.Unstable;
        }

        await _ctx
            .Announcer.AnnounceAsync(
                new Announcement(kind, part.Number, label, part.Value, part.DeviationPpm, "", completesSet),
                ct
            )
            .ConfigureAwait(false);
        CrashPoint.Pass(CrashSite.Announce);
        var announced = await DurablyAsync(
                $"the announcement of part {part.Number}",
                c => _ctx.Log.MarkAnnouncedAsync(part.Id, c),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Snapshot.Upsert(ToView(announced));
    }
}
