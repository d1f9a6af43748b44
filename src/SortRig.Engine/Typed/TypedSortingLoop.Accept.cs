using SortRig.Engine.Announcing;
using SortRig.Engine.Durability;
using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Typed;

internal sealed partial class TypedSortingLoop
{
    private static readonly TimeSpan s_storageRetry = TimeSpan.FromSeconds(2);

    private async Task AcceptAsync(HandSettleVerdict verdict, CancellationToken ct)
    {
        var number = _partsRecorded + 1;
        var measured = verdict.Value!;
        var entries = verdict.Entries!;
        var decision = _ctx.Cups.Assign(new CupRequest(number, Options.Nominal, measured));
        var commit = new PartCommit(
            Guid.NewGuid(),
            _session.Id,
            _batch!.Id,
            measured,
            _range.FullScale,
            TypedNplc,
            null,
            entries[^1].Time,
            decision.IsSlot ? null : decision.CupLabel,
            decision.IsSlot ? decision.CupLabel : null,
            [.. entries],
            PartState.Accepted
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

        _partsRecorded++;
        _lastLive = stored;
        var kind = decision.IsReject ? AnnouncementKind.Reject : AnnouncementKind.Cup;
        await AnnounceStoredAsync(stored, kind, decision.CompletesSet, ct).ConfigureAwait(false);
        PublishCounts();
    }

    private async Task RecordUnstableAsync(HandSettleVerdict verdict, CancellationToken ct)
    {
        var values = verdict.Entries!.Select(r => r.Value).ToArray();
        var mean = values.Average();
        var spread = values.Length > 1 ? MathNet.Numerics.Statistics.Statistics.StandardDeviation(values) : 0;
        var commit = new PartCommit(
            Guid.NewGuid(),
            _session.Id,
            _batch!.Id,
            new MeasuredValue(mean, spread, spread),
            _range.FullScale,
            TypedNplc,
            null,
            verdict.Entries![^1].Time,
            null,
            null,
            [.. verdict.Entries!],
            PartState.Unstable
        );
        var stored = await DurablyAsync($"part {_partsRecorded + 1}", c => _ctx.Log.CommitPartAsync(commit, c), ct)
            .ConfigureAwait(false);
        _partsRecorded++;
        _unstable++;
        _ctx.Snapshot.Upsert(ToView(stored));
        await _ctx
            .Announcer.AnnounceAsync(
                new Announcement(AnnouncementKind.Unstable, stored.Number, "", mean, double.NaN, verdict.Prompt),
                ct
            )
            .ConfigureAwait(false);
        await DurablyAsync(
                $"the announcement of part {stored.Number}",
                c => _ctx.Log.MarkAnnouncedAsync(stored.Id, c),
                ct
            )
            .ConfigureAwait(false);
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
        var announced = await DurablyAsync(
                $"the announcement of part {part.Number}",
                c => _ctx.Log.MarkAnnouncedAsync(part.Id, c),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Snapshot.Upsert(ToView(announced));
    }

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
            p.AcceptedAt
        );

    // As in the hands-free loop: a storage fault an operator can clear pauses and retries the same idempotent write.
    private async Task<T> DurablyAsync<T>(string what, Func<CancellationToken, Task<T>> write, CancellationToken ct)
    {
        var told = false;
        while (true)
        {
            try
            {
                var result = await write(ct).ConfigureAwait(false);
                if (told)
                {
                    await SayAsync($"storage is back: {what} saved, carrying on", ct).ConfigureAwait(false);
                }

                return result;
            }
            catch (StorageException e) when (!ct.IsCancellationRequested && StorageFaultRule.OperatorCanClear(e.Fault))
            {
                _storageFaults++;
                Log.SortStorageFault(_ctx.Logger, e.Operation, e.Fault.ToString(), e.Message);
                if (!told)
                {
                    told = true;
                    await SayAsync(
                            $"storage fault, {StorageFaultRule.Plain(e.Fault)}: paused, nothing lost; {what} is not "
                                + $"saved yet. Retrying every {s_storageRetry.TotalSeconds:0} s. {e.Message}",
                            ct
                        )
                        .ConfigureAwait(false);
                }

                await Task.Delay(s_storageRetry, _ctx.Time, ct).ConfigureAwait(false);
            }
        }
    }
}
