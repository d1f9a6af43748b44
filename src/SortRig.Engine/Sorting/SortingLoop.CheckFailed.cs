using SortRig.Engine.Announcing;
using SortRig.Engine.Operator;
using SortRig.Measurement.Control;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;
using static System.FormattableString;

namespace SortRig.Engine.Sorting;

// A check out of control: pause and say why; the parts since the last good check are already flagged (in the same
// transaction as the check). The operator chooses: re-reference to the check and measure the flagged parts again (R),
// carry on leaving them flagged (P; they stay out of planning and picking), or finish (F).
public sealed partial class SortingLoop
{
    private async Task OutOfControlAsync(CheckRecord record, ControlVerdict verdict, CancellationToken ct)
    {
        var suspects = await _ctx.Log.GetSuspectPartsAsync(_session.Id, ct).ConfigureAwait(false);
        var said =
            Invariant($"check {record.Seq} out of control: {verdict.Reason}. Paused. {suspects.Count} parts ")
            + "measured since the last good check are flagged: R to re-reference to the check and measure them again, "
            + "P to carry on leaving them flagged, F to finish";
        await AskAboutFlaggedAsync(said, suspects.Count, reReference: true, ct).ConfigureAwait(false);
    }

    // A resumed session whose start check is in control, with parts an earlier check flagged and nobody measured
    // again: offer them at once (the meter reads true again, so no re-reference), or carry on leaving them flagged.
    private async Task OfferWaitingFlaggedAsync(CancellationToken ct)
    {
        var waiting = await _ctx.Log.GetSuspectPartsAsync(_session.Id, ct).ConfigureAwait(false);
        if (waiting.Count > 0)
        {
            var said =
                Invariant($"{waiting.Count} parts flagged by an earlier check wait to be measured again. Paused. ")
                + "R to measure them again now, P to carry on leaving them flagged, F to finish";
            await AskAboutFlaggedAsync(said, waiting.Count, reReference: false, ct).ConfigureAwait(false);
        }
    }

    // Pauses, says what waits, and takes the operator's answer: R measures the flagged parts again (after reading the
    // check once more when the meter moved), P carries on leaving them flagged, F finishes.
    private async Task AskAboutFlaggedAsync(string said, int flagged, bool reReference, CancellationToken ct)
    {
        _paused = true;
        _ctx.Snapshot.UpdateSession(s => s with { Paused = true });
        await SayAsync(said, ct).ConfigureAwait(false);
        while (true)
        {
            var command = await _ctx.Commands.TakeAsync(ct).ConfigureAwait(false);
            switch (command)
            {
                case OperatorCommand.RemeasureFlagged:
                    if (reReference)
                    {
                        await ReReferenceAsync(ct).ConfigureAwait(false);
                    }

                    await RemeasureFlaggedAsync(ct).ConfigureAwait(false);
                    break;
                case OperatorCommand.TogglePause:
                    await SayAsync($"carrying on; {flagged} parts stay flagged until measured again", ct)
                        .ConfigureAwait(false);
                    break;
                case OperatorCommand.Finish:
                    _finishRequested = true;
                    break;
                default:
                    continue; // undo and measure-again concern a part in the fixture: there is none while paused here
            }

            _paused = false;
            _ctx.Snapshot.UpdateSession(s => s with { Paused = false });
            return;
        }
    }

    // Reads the check again, re-seated as often as the baseline was (one reading would carry its own noise into every
    // later value and tilt the chart by it), and puts the meter's values back on the check's scale from the mean.
    private async Task ReReferenceAsync(CancellationToken ct)
    {
        var readings = new List<(MeasuredValue Value, DateTimeOffset At)>(Options.CheckBaseline);
        for (var i = 0; i < Options.CheckBaseline; i++)
        {
            readings.Add(await ReadCheckAsync("re-reference", ct).ConfigureAwait(false));
        }

        var mean = readings.Average(r => r.Value.Value);
        var centre = _checkLimits!.Centre;
        _checkScale = centre / mean;
        var shiftPpm = ((mean / centre) - 1) * 1e6;
        _checkPoints.Clear();
        var why =
            Invariant($"re-referenced on {readings.Count} readings: the meter reads {shiftPpm:+0.0;-0.0} ppm ")
            + "against the check's centre";
        foreach (var (value, at) in readings)
        {
            await RecordCheckAsync(_check!, value, at, null, "ReReferenced", why, ct).ConfigureAwait(false);
        }

        await SayAsync(why + "; values are put back on the check's scale", ct).ConfigureAwait(false);
    }

    private async Task RemeasureFlaggedAsync(CancellationToken ct)
    {
        var suspects = await _ctx.Log.GetSuspectPartsAsync(_session.Id, ct).ConfigureAwait(false);
        foreach (var id in suspects)
        {
            var part = await _ctx.Log.GetPartAsync(id, ct).ConfigureAwait(false);
            if (part is not { IsLive: true })
            {
                continue;
            }

            var where = part.SlotLabel is { } slot ? $"slot {slot}" : $"cup {part.CupLabel}";
            await SayAsync($"measure again: take part {part.Number} out of {where} and put it in the fixture", ct)
                .ConfigureAwait(false);
            await _ctx.Hands.PlacePartAgainAsync(ReelPosition(part.Number), ct).ConfigureAwait(false);
            var (acceptance, readings) = await SettleOneAsync($"part {part.Number}", ct).ConfigureAwait(false);
            var measured = OnReferenceScale(acceptance.Value);
            _ctx.Cups.Undo(part.Number);
            var number = NextNumber;
            var decision = _ctx.Cups.Assign(new CupRequest(number, Options.Nominal, measured));
            var commit = new PartCommit(
                Guid.NewGuid(),
                _session.Id,
                _batch.Id,
                measured,
                _ctx.Plan.Range,
                _ctx.Plan.Nplc,
                null,
                readings[^1].Time,
                decision.IsSlot ? null : decision.CupLabel,
                decision.IsSlot ? decision.CupLabel : null,
                readings,
                PartState.Accepted,
                acceptance.AcceptedBy
            );
            // The new record and the old one marked measured again in one transaction: a crash between them
            // can neither lose the part nor keep it twice.
            var replaced = new PartCorrection(id, PartCorrectionKind.Remeasure, Note: RemeasuredAs);
            var stored = await DurablyAsync(
                    $"part {part.Number} measured again",
                    c => _ctx.Log.CommitRemeasureAsync(commit, replaced, c),
                    ct
                )
                .ConfigureAwait(false);
            _extraPositions[stored.Number] = ReelPosition(part.Number);
            _ctx.Snapshot.Upsert(ToView(part with { State = PartState.Remeasured }));
            var kind = decision.IsReject ? AnnouncementKind.Reject : AnnouncementKind.Cup;
            await AnnounceStoredAsync(stored, kind, decision.CompletesSet, ct).ConfigureAwait(false);
            PublishCounts();
            _ctx.Hands.RemoveBridgingPart();
            await WaitForBridgeRemovalAsync(ct).ConfigureAwait(false);
        }

        var left = await _ctx.Log.GetSuspectPartsAsync(_session.Id, ct).ConfigureAwait(false);
        if (_ctx.Snapshot.LastCheck is { } shown)
        {
            _ctx.Snapshot.SetCheck(shown with { Flagged = left.Count }); // the page's button goes with them
        }

        await SayAsync($"{suspects.Count} flagged parts measured again", ct).ConfigureAwait(false);
    }
}
