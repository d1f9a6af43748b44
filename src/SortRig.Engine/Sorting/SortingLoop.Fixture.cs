using SortRig.Engine.Announcing;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // A decided part no longer cools by more than a few ppm (common practice, no source).
    private const double SwapFloorPpm = 25;

    // Reading period at the batch's NPLC; a stall is a gap longer than a quarter of the time allowed to settle, and
    // at least three reading periods (our choice): the window then no longer shows one continuous settling, so the
    // part is settled again rather than timed out as unstable. Another part is a reading farther from the decided
    // value than the larger of 25 ppm of it and ten times the meter's reading noise at this NPLC.
    private static FixtureWatch NewFixtureWatch(SortPlan plan)
    {
        var period = TimeSpan.FromSeconds(1 / plan.Decision.Nplc.ReadingsPerSecond);
        var stall = TimeSpan.FromTicks(Math.Max(plan.Settle.MaxSettleTime.Ticks / 4, 3 * period.Ticks));
        var noise = 10 * plan.Decision.Nplc.NoisePpmOfRange * 1e-6 * plan.Range;
        return new FixtureWatch(period, stall, value => Math.Max(SwapFloorPpm * 1e-6 * Math.Abs(value), noise));
    }

    // The fixture watch's verdicts on one reading, applied before the settle rule sees it.
    private async Task WatchFixtureAsync(Reading reading, CancellationToken ct)
    {
        var stall = _fixture.CheckStall(reading, _tracker.State);
        if (stall.Action == FixtureAction.Excuse)
        {
            _tracker.Excuse(stall.Excused);
        }
        else if (stall.Action == FixtureAction.Remeasure)
        {
            _tracker.Remeasure();
            await _ctx.Announcer.AnnounceAsync(Announcement.Info(stall.Message!), ct).ConfigureAwait(false);
        }

        var swap = _fixture.CheckSwap(
            reading,
            _tracker.State,
            _lastLive is { } last ? (last.Number, last.CupLabel) : null
        );
        if (swap.Action == FixtureAction.NewPart)
        {
            _tracker.Reset();
            _lastLiveStillInFixture = false;
            await _ctx.Announcer.AnnounceAsync(Announcement.Info(swap.Message!), ct).ConfigureAwait(false);
        }
    }
}
