using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Typed;

/// <summary>
/// Sorting with a meter that has no computer link: the operator sets the range the range rule names, types each
/// value off the display, and the settle rule for people accepts a part when its entries agree. From the accepted
/// value on, everything is as in <see cref="SortingLoop"/>: the cup assigner, the precision log (durable first),
/// the announcement, resume. One instance runs one session once.
/// </summary>
internal sealed partial class TypedSortingLoop(TypedContext context)
{
    private readonly TypedContext _ctx = context;
    private HandSettle _settle = null!;
    private DisplayRange _range = null!;
    private SessionInfo _session = null!;
    private BatchInfo? _batch;
    private int _partsRecorded;
    private int _unstable;
    private int _storageFaults;
    private bool _finishRequested;
    private bool _inputEnded;
    private string? _next;

    private SortOptions Options => _ctx.Options;

    private bool Done => _finishRequested || (Options.Parts > 0 && _partsRecorded >= Options.Parts);

    /// <summary>Runs until the planned parts are recorded, the operator types "finish", input ends, or
    /// cancellation.</summary>
    public async Task<SortOutcome> RunAsync(CancellationToken cancellationToken)
    {
        await OpenSessionAsync(cancellationToken).ConfigureAwait(false);
        if (!Done && await ChooseRangeAsync(cancellationToken).ConfigureAwait(false))
        {
            _settle = new HandSettle(_range, _ctx.Settle);
            while (!Done && !cancellationToken.IsCancellationRequested)
            {
                var line = await _ctx.Entries.AskAsync(_next ?? PartPrompt(), cancellationToken).ConfigureAwait(false);
                if (line is null)
                {
                    _inputEnded = true;
                    break;
                }

                await OnLineAsync(line.Trim(), cancellationToken).ConfigureAwait(false);
            }

            // A stop that lands between two lines still ends as a stop, never as a finished session.
            if (!Done && !_inputEnded)
            {
                cancellationToken.ThrowIfCancellationRequested();
            }
        }

        if (Done && !_inputEnded)
        {
            await DurablyAsync(
                    "the end of the session",
                    c => _ctx.Log.FinishSessionAsync(_session.Id, c),
                    cancellationToken
                )
                .ConfigureAwait(false);
            _ctx.Snapshot.UpdateSession(s => s with { Finished = true });
            _ctx.Hub.Publish(new BenchEvent(0, BenchEventKind.Finished, default, Text: $"{_partsRecorded} parts"));
        }

        var live = _ctx
            .Snapshot.Parts()
            .Count(p => p.State is nameof(PartState.Accepted) or nameof(PartState.Announced));
        return new SortOutcome(_session.Id, _partsRecorded, live, _unstable, 0, _finishRequested, _storageFaults);
    }

    private string PartPrompt() =>
        $"part {_partsRecorded + 1}: type the display ({_range.UnitName} on the {_range.Name} range), or 'undo', "
        + $"'again', 'finish'";

    private async Task OnLineAsync(string line, CancellationToken ct)
    {
        if (line.Equals("finish", StringComparison.OrdinalIgnoreCase))
        {
            _finishRequested = true;
            return;
        }

        if (line.Equals("undo", StringComparison.OrdinalIgnoreCase))
        {
            await UndoLastAsync(ct).ConfigureAwait(false);
            return;
        }

        if (line.Equals("again", StringComparison.OrdinalIgnoreCase))
        {
            _settle.Reset();
            _next = $"starting part {_partsRecorded + 1} over: " + PartPrompt();
            return;
        }

        var check = EntryCheck.Check(line, _range, Options.Nominal);
        if (!check.Passed)
        {
            _next = check.Problem;
            return;
        }

        var entry = Reading.Finite(check.Ohms, _ctx.Time.GetUtcNow(), _range.FullScale);
        var verdict = _settle.Add(entry);
        PublishEntry(entry, verdict);
        switch (verdict.State)
        {
            case HandSettleState.Accepted:
                await AcceptAsync(verdict, ct).ConfigureAwait(false);
                _settle.Reset();
                _next = null;
                break;
            case HandSettleState.Unstable:
                await RecordUnstableAsync(verdict, ct).ConfigureAwait(false);
                _settle.Reset();
                _next = null;
                break;
            default:
                _next = $"part {_partsRecorded + 1}: {verdict.Prompt}";
                break;
        }
    }

    private void PublishEntry(Reading entry, HandSettleVerdict verdict) =>
        _ctx.Hub.Publish(
            new BenchEvent(
                0,
                BenchEventKind.Reading,
                default,
                Value: entry.Value,
                DeviationPpm: (entry.Value - Options.Nominal) / Options.Nominal * 1e6,
                State: verdict.State.ToString(),
                Text: verdict.Prompt
            )
        );
}
