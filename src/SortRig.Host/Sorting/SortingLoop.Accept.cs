using SortRig.Host.Announcing;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Sorting;

public sealed partial class SortingLoop
{
    private static readonly TimeSpan s_storageRetry = TimeSpan.FromSeconds(2);

    private async Task AcceptAsync(SettleAcceptance acceptance, CancellationToken ct)
    {
        // A meter reset to its defaults mid-part would have changed range or NPLC under us: check
        // before trusting the window, re-apply the setup and measure the part again.
        if (!await VerifySetupAsync(ct).ConfigureAwait(false))
        {
            _tracker.Remeasure();
            return;
        }

        var number = _partsRecorded + 1;
        var decision = _ctx.Cups.Assign(new CupRequest(number, Options.Nominal, acceptance.Value));
        var commit = new PartCommit(
            Guid.NewGuid(), _session.Id, _batch.Id, acceptance.Value, _ctx.Plan.Range, _ctx.Plan.Nplc, null,
            acceptance.Readings[^1].Time, decision.CupLabel, null, [.. _partReadings], PartState.Accepted);
        PartRecord stored;
        try
        {
            stored = await CommitAsync(commit, ct).ConfigureAwait(false);
        }
        catch
        {
            _ctx.Cups.Undo(number);
            throw;
        }

        _partsRecorded++;
        _lastLive = stored;
        _lastLiveStillInFixture = true;
        var kind = decision.IsReject ? AnnouncementKind.Reject : AnnouncementKind.Cup;
        await AnnounceStoredAsync(stored, kind, decision.CompletesSet, ct).ConfigureAwait(false);
        PublishCounts();
        _ctx.Hands.PartAnnounced();
    }

    private async Task RecordUnstableAsync(SettleFailure failure, CancellationToken ct)
    {
        var finite = _partReadings.Where(r => r.IsFinite).Select(r => r.Value).ToArray();
        var mean = finite.Length > 0 ? finite.Average() : 0;
        var spread = finite.Length > 1 ? MathNet.Numerics.Statistics.Statistics.StandardDeviation(finite) : 0;
        var commit = new PartCommit(
            Guid.NewGuid(), _session.Id, _batch.Id, new MeasuredValue(mean, spread, spread), _ctx.Plan.Range, _ctx.Plan.Nplc, null,
            _ctx.Time.GetUtcNow(), null, null, [.. _partReadings], PartState.Unstable);
        var stored = await CommitAsync(commit, ct).ConfigureAwait(false);
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
        await _ctx.Announcer.AnnounceAsync(
            new Announcement(AnnouncementKind.Unstable, stored.Number, "", mean, double.NaN, why), ct).ConfigureAwait(false);
        await _ctx.Log.MarkAnnouncedAsync(stored.Id, ct).ConfigureAwait(false);
        _ctx.Hands.PartAnnounced();
    }

    // Durable before announced: the announcement only follows a committed part. A storage fault
    // pauses the loop and retries the same idempotent commit until it goes through.
    private async Task<PartRecord> CommitAsync(PartCommit commit, CancellationToken ct)
    {
        var told = false;
        while (true)
        {
            try
            {
                var stored = await _ctx.Log.CommitPartAsync(commit, ct).ConfigureAwait(false);
                if (told)
                {
                    await _ctx.Announcer.AnnounceAsync(Announcement.Info("storage is back: part saved, carrying on"), ct).ConfigureAwait(false);
                }

                return stored;
            }
            catch (StorageException e) when (!ct.IsCancellationRequested)
            {
                LogStorageFault(_ctx.Logger, e.Operation, e.Fault.ToString(), e.Message);
                if (!told)
                {
                    told = true;
                    await _ctx.Announcer.AnnounceAsync(
                        Announcement.Info($"storage fault ({e.Fault}): paused, nothing lost; the part stays in the fixture until it is saved. {e.Message}"),
                        ct).ConfigureAwait(false);
                }

                await Task.Delay(s_storageRetry, _ctx.Time, ct).ConfigureAwait(false);
            }
        }
    }

    private async Task AnnounceStoredAsync(PartRecord part, AnnouncementKind kind, bool completesSet, CancellationToken ct)
    {
        var label = part.CupLabel ?? part.SlotLabel ?? "";
        if (kind == AnnouncementKind.Repeat && label.Length == 0)
        {
            kind = AnnouncementKind.Unstable;
        }

        await _ctx.Announcer.AnnounceAsync(
            new Announcement(kind, part.Number, label, part.Value, part.DeviationPpm, "", completesSet), ct).ConfigureAwait(false);
        var announced = await _ctx.Log.MarkAnnouncedAsync(part.Id, ct).ConfigureAwait(false);
        _ctx.Snapshot.Upsert(ToView(announced));
    }
}
