using SortRig.Engine.Events;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;
using static System.FormattableString;

namespace SortRig.Engine.Sorting;

/// <summary>
/// The hands-free sorting loop: read continuously, let the settle rule decide, commit each part
/// to the precision log, then announce its cup, then wait for the part to be removed.
/// One instance runs one session once.
/// </summary>
public sealed partial class SortingLoop
{
    private readonly SortContext _ctx;
    private readonly SettleTracker _tracker;
    private readonly List<Reading> _partReadings = [];
    private readonly ResilientMeter _meter;
    private readonly FixtureWatch _fixture;
    private SessionInfo _session = null!;
    private BatchInfo _batch = null!;
    private int _partsRecorded;
    private int _unstable;
    private int _faults;
    private int _storageFaults;
    private bool _paused;
    private bool _finishRequested;
    private PartRecord? _lastLive;
    private bool _lastLiveStillInFixture;

    public SortingLoop(SortContext context)
    {
        _ctx = context;
        _tracker = new SettleTracker(context.Plan.Decision.Range, context.Plan.Decision.Nplc, context.Plan.Settle);
        _meter = new ResilientMeter(context.ConnectAsync, Setup, identify: true); // the batch records the instrument
        _fixture = NewFixtureWatch(context.Plan);
    }

    private SortOptions Options => _ctx.Plan.Options;

    /// <summary>Runs until the planned number of parts is recorded, the operator finishes, or cancellation.</summary>
    public async Task<SortOutcome> RunAsync(CancellationToken cancellationToken)
    {
        try
        {
            // Meet the meter first: the batch records which instrument measured it.
            await ConnectWithRetryAsync(cancellationToken).ConfigureAwait(false);
            await OpenSessionAsync(cancellationToken).ConfigureAwait(false);
            if (_check is not null && !Done)
            {
                await RunCheckAsync("start", resumeFeeding: true, atStart: true, cancellationToken)
                    .ConfigureAwait(false);
            }

            await AnnounceReadyAsync(cancellationToken).ConfigureAwait(false);
            while (!cancellationToken.IsCancellationRequested && !Done)
            {
                await HandleCommandsAsync(cancellationToken).ConfigureAwait(false);
                if (_paused)
                {
                    await WaitWhilePausedAsync(cancellationToken).ConfigureAwait(false);
                    continue;
                }

                if (Done)
                {
                    break;
                }

                if (CheckDue)
                {
                    await RunCheckAsync(CheckWhen, resumeFeeding: true, atStart: false, cancellationToken)
                        .ConfigureAwait(false);
                    continue;
                }

                var reading = await ReadAsync(cancellationToken).ConfigureAwait(false);
                if (reading is { } r)
                {
                    await OnReadingAsync(r, cancellationToken).ConfigureAwait(false);
                }
            }

            // A stop that lands where nothing awaited throws (a reading already in, a durable write past its start
            // check) ends the loop at its head: it is still a stop, never a finished session (exit 130, resume hint).
            if (!Done)
            {
                cancellationToken.ThrowIfCancellationRequested();
            }

            if (Done && _check is not null && _partsRecorded > _partsAtLastCheck)
            {
                await RunCheckAsync("end", resumeFeeding: false, atStart: false, cancellationToken)
                    .ConfigureAwait(false);
            }

            if (Done)
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
        }
        finally
        {
            await _meter.DisposeAsync().ConfigureAwait(false);
        }

        var live = _ctx
            .Snapshot.Parts()
            .Count(p => p.State is nameof(PartState.Accepted) or nameof(PartState.Announced));
        return new SortOutcome(_session.Id, _partsRecorded, live, _unstable, _faults, _finishRequested, _storageFaults)
        {
            Build = BuildOutcome,
        };
    }

    private bool Done =>
        _finishRequested
        || SetsComplete
        || (PlannedParts > 0 && _partsRecorded >= PlannedParts && !_tracker.State.IsBusy());

    private int PlannedParts => Options.Parts;

    private string CheckWhen => Invariant($"after {_partsRecorded - _partsAtLastCheck} parts");

    private async Task OnReadingAsync(Reading reading, CancellationToken ct)
    {
        await WatchFixtureAsync(reading, ct).ConfigureAwait(false);
        var before = _tracker.State;
        if (before is SettleState.Empty && reading.IsFinite)
        {
            _partReadings.Clear();
            _lastLiveStillInFixture = false;
        }

        var collecting =
            before is SettleState.Bouncing or SettleState.Settling || (before is SettleState.Empty && reading.IsFinite);
        if (collecting)
        {
            _partReadings.Add(reading);
        }

        var verdict = _tracker.Add(reading);
        PublishReading(reading, verdict);
        switch (verdict.State)
        {
            case SettleState.Accepted:
                _fixture.NoteDecided(verdict.Acceptance!.Value.Value);
                await AcceptAsync(verdict.Acceptance!, ct).ConfigureAwait(false);
                break;
            case SettleState.Unstable:
                _fixture.NoteDecided(
                    _partReadings.Where(r => r.IsFinite).Select(r => r.Value).DefaultIfEmpty(double.NaN).Average()
                );
                await RecordUnstableAsync(verdict.Failure!, ct).ConfigureAwait(false);
                break;
            case SettleState.Removed:
                _partReadings.Clear();
                _lastLiveStillInFixture = false;
                break;
        }
    }

    private void PublishReading(Reading reading, SettleVerdict verdict)
    {
        var live = verdict.Live;
        var text = live.SemPpm is { } sem
            ? FormattableString.Invariant(
                $"sem {sem:0.0} ppm  slope {live.SlopePpmPerSecond:0.0} ppm/s  {live.Elapsed.TotalSeconds:0.0} s"
            )
            : null;
        _ctx.Hub.Publish(
            new BenchEvent(
                0,
                BenchEventKind.Reading,
                default,
                Value: reading.IsFinite ? reading.Value : double.PositiveInfinity,
                DeviationPpm: reading.IsFinite ? (reading.Value - Options.Nominal) / Options.Nominal * 1e6 : null,
                State: verdict.State.ToString(),
                Text: text
            )
        );
    }
}
