using SortRig.Engine.Announcing;
using SortRig.Engine.Operator;
using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private static readonly TimeSpan s_pausePoll = TimeSpan.FromMilliseconds(200);

    private async Task HandleCommandsAsync(CancellationToken ct)
    {
        while (_ctx.Commands.TryTake(out var command))
        {
            await ApplyAsync(command, ct).ConfigureAwait(false);
        }
    }

    private async Task WaitWhilePausedAsync(CancellationToken ct)
    {
        var command = await _ctx.Commands.TakeAsync(ct).ConfigureAwait(false);
        await ApplyAsync(command, ct).ConfigureAwait(false);
    }

    private async Task ApplyAsync(OperatorCommand command, CancellationToken ct)
    {
        switch (command)
        {
            case OperatorCommand.UndoLast:
                await UndoLastAsync(PartCorrectionKind.Undo, ct).ConfigureAwait(false);
                break;
            case OperatorCommand.Remeasure:
                if (_tracker.State == SettleState.AwaitingRemoval && _lastLiveStillInFixture)
                {
                    await UndoLastAsync(PartCorrectionKind.Remeasure, ct).ConfigureAwait(false);
                }

                _tracker.Remeasure();
                await _ctx
                    .Announcer.AnnounceAsync(Announcement.Info("measuring the part in the fixture again"), ct)
                    .ConfigureAwait(false);
                break;
            case OperatorCommand.TogglePause:
                _paused = !_paused;
                _ctx.Snapshot.UpdateSession(s => s with { Paused = _paused });
                await _ctx
                    .Announcer.AnnounceAsync(Announcement.Info(_paused ? "paused (P to carry on)" : "carrying on"), ct)
                    .ConfigureAwait(false);
                break;
            case OperatorCommand.Finish:
                _finishRequested = true;
                _paused = false;
                await _ctx
                    .Announcer.AnnounceAsync(Announcement.Info("finishing the session"), ct)
                    .ConfigureAwait(false);
                break;
        }
    }

    // The last live part went into the wrong cup (or is measured again): the log keeps its history,
    // the cup planner forgets it, and the operator is told where to take it from.
    private async Task UndoLastAsync(PartCorrectionKind kind, CancellationToken ct)
    {
        if (_lastLive is not { } last)
        {
            await _ctx.Announcer.AnnounceAsync(Announcement.Info("nothing to undo"), ct).ConfigureAwait(false);
            return;
        }

        var undone = await _ctx
            .Log.UndoPartAsync(new PartCorrection(last.Id, kind, Note: "operator"), ct)
            .ConfigureAwait(false);
        _ctx.Cups.Undo(last.Number);
        _ctx.Snapshot.Upsert(ToView(undone));
        _lastLive = null;
        _lastLiveStillInFixture = false;
        PublishCounts();
        var where = last.CupLabel ?? last.SlotLabel ?? "its cup";
        await _ctx
            .Announcer.AnnounceAsync(
                Announcement.Info($"part {last.Number} undone: take it out of {where} and measure it again"),
                ct
            )
            .ConfigureAwait(false);
    }
}
