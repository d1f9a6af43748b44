using SortRig.Storage.Contracts;

namespace SortRig.Engine.Typed;

internal sealed partial class TypedSortingLoop
{
    private PartRecord? _lastLive;

    // "undo": the last live part went into the wrong cup or was typed wrong. As in the hands-free loop the log keeps
    // its history, the cup planner forgets it, and the operator is told where to take it from.
    private async Task UndoLastAsync(CancellationToken ct)
    {
        _settle.Reset();
        if (_lastLive is not { } last)
        {
            _next = "nothing to undo: " + PartPrompt();
            return;
        }

        var undone = await DurablyAsync(
                $"the undo of part {last.Number}",
                c => _ctx.Log.UndoPartAsync(new PartCorrection(last.Id, PartCorrectionKind.Undo, Note: "operator"), c),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Cups.Undo(last.Number);
        _ctx.Snapshot.Upsert(ToView(undone));
        _lastLive = null;
        PublishCounts();
        await SayAsync(
                $"part {last.Number} undone: take it out of {last.CupLabel ?? last.SlotLabel ?? "its cup"} and "
                    + $"measure it again",
                ct
            )
            .ConfigureAwait(false);
        _next = null;
    }
}
