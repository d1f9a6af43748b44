using SortRig.Host.Announcing;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Host.Sorting;

public sealed partial class SortingLoop
{
    private DateTimeOffset? _lastReadingTime;

    // A gap between two readings of a settling part longer than this means the readings stopped
    // (the process was suspended or starved): the window no longer shows one continuous settling,
    // so the part is settled again rather than timed out as unstable. A quarter of the time allowed
    // to settle, and at least three reading periods (our choice).
    private TimeSpan StallGap => TimeSpan.FromTicks(Math.Max(_ctx.Plan.Settle.MaxSettleTime.Ticks / 4, 3 * ReadingPeriod.Ticks));

    private TimeSpan ReadingPeriod => TimeSpan.FromSeconds(1 / _ctx.Plan.Decision.Nplc.ReadingsPerSecond);

    private async Task DetectStallAsync(Reading reading, CancellationToken ct)
    {
        var gap = reading.Time - (_lastReadingTime ?? reading.Time);
        _lastReadingTime = reading.Time;

        // Waiting for removal, a gap of more than two reading periods is long enough for a quick
        // hand to take the part out and put the next one in unseen.
        if (gap > 2 * ReadingPeriod && _tracker.State == SettleState.AwaitingRemoval)
        {
            _streamBroken = true;
        }

        if (gap > StallGap && _tracker.State.IsBusy())
        {
            _tracker.Remeasure();
            await _ctx.Announcer.AnnounceAsync(
                Announcement.Info(FormattableString.Invariant($"no reading for {gap.TotalSeconds:0} s: measuring the part again")), ct).ConfigureAwait(false);
        }
    }
}
