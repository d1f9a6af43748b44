using SortRig.Engine.Announcing;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private DateTimeOffset? _lastReadingTime;
    private bool _gapIsFault;

    // A gap between two readings of a settling part longer than this means the readings stopped
    // (the process was suspended or starved): the window no longer shows one continuous settling,
    // so the part is settled again rather than timed out as unstable. A quarter of the time allowed
    // to settle, and at least three reading periods (our choice).
    private TimeSpan StallGap => TimeSpan.FromTicks(Math.Max(_ctx.Plan.Settle.MaxSettleTime.Ticks / 4, 3 * ReadingPeriod.Ticks));

    private TimeSpan ReadingPeriod => TimeSpan.FromSeconds(1 / _ctx.Plan.Decision.Nplc.ReadingsPerSecond);

    // A meter fault cut the readings off; the gap up to the next reading is the outage's.
    private void NoteOutage() => _gapIsFault = _lastReadingTime is not null;

    private async Task DetectStallAsync(Reading reading, CancellationToken ct)
    {
        var gap = reading.Time - (_lastReadingTime ?? reading.Time);
        var fault = _gapIsFault;
        _lastReadingTime = reading.Time;
        _gapIsFault = false;

        // Waiting for removal, a gap of more than two reading periods is long enough for a quick
        // hand to take the part out and put the next one in unseen.
        if (!fault && gap > 2 * ReadingPeriod && _tracker.State == SettleState.AwaitingRemoval)
        {
            _streamBroken = true;
        }

        if (!_tracker.State.IsBusy() || gap <= 2 * ReadingPeriod)
        {
            return;
        }

        if (!fault && gap > StallGap)
        {
            _tracker.Remeasure();
            await _ctx.Announcer.AnnounceAsync(
                Announcement.Info(FormattableString.Invariant($"no reading for {gap.TotalSeconds:0} s: measuring the part again")), ct).ConfigureAwait(false);
            return;
        }

        // Time the meter could not deliver readings (an outage, a slow host) is not time the part
        // failed to settle in: the settle limit counts only time with readings coming.
        _tracker.Excuse(gap - ReadingPeriod);
    }
}
