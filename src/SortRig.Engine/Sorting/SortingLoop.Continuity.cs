using SortRig.Engine.Announcing;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // Readings in a row, all far from the part just decided, that mean another part is in the fixture.
    private const int SwapEvidence = 2;

    // A decided part no longer cools by more than a few ppm (common practice, no source).
    private const double SwapFloorPpm = 25;

    // After a broken stream, a part that reads like the decided one and is still in the fixture this
    // long after readings resumed is taken for a new part: the operator takes an announced part out
    // within seconds (our choice; a person who really left it in hears a new number and presses U).
    private static readonly TimeSpan s_stillThere = TimeSpan.FromSeconds(20);

    private double? _decidedValue;
    private DateTimeOffset? _ambiguousSince;
    private bool _streamBroken;
    private int _swapReadings;

    // The tracker learns that a part was taken out from overload readings. When a meter fault cut
    // the readings off while it waited for that, the operator may have taken the part out and put
    // the next one in meanwhile: without a check the loop would wait for a removal it already missed.
    private void NoteStreamBroken()
    {
        NoteOutage(); // the gap that follows is the fault's: it is excused, never a stall
        if (_tracker.State == SettleState.AwaitingRemoval)
        {
            _streamBroken = true;
            _swapReadings = 0;
        }
    }

    private void NoteDecided(double value)
    {
        _decidedValue = value;
        _streamBroken = false;
        _ambiguousSince = null;
        _swapReadings = 0;
    }

    // Called before the tracker sees the reading, after a broken stream (a meter fault, or an
    // overload, while waiting for the decided part to be taken out): readings far from the
    // decided part's value (twice in a row, so one garbled reply is not enough) are a new part; so
    // is a part that reads like it but stays in the fixture (values alone cannot tell two parts
    // closer than the threshold apart).
    private async Task DetectSwapAsync(Reading reading, CancellationToken ct)
    {
        // One overload is not yet a removal (the tracker wants two in a row), but it shows the contact
        // opened: a quick hand may have changed the part within one reading period.
        if (_tracker.State == SettleState.AwaitingRemoval && !reading.IsFinite)
        {
            _streamBroken = true;
        }

        if (!_streamBroken || _tracker.State != SettleState.AwaitingRemoval || _decidedValue is not { } decided)
        {
            _streamBroken = false;
            _ambiguousSince = null;
            return;
        }

        _ambiguousSince ??= reading.Time;
        if (!reading.IsFinite)
        {
            _swapReadings = 0;
            return;
        }

        string? why = null;
        if (Math.Abs(reading.Value - decided) > SwapThreshold(decided))
        {
            why = ++_swapReadings >= SwapEvidence ? "a new part went in before the fixture was seen empty: measuring it" : null;
        }
        else
        {
            _swapReadings = 0;
            why = reading.Time - _ambiguousSince.Value > s_stillThere
                ? "a part is still in the fixture after the meter came back: measuring it as a new part"
                    + (_lastLive is { } last ? $" (if it is part {last.Number}, put it in cup {last.CupLabel} and press U)" : "")
                : null;
        }

        if (why is null)
        {
            return;
        }

        _tracker.Reset();
        _streamBroken = false;
        _ambiguousSince = null;
        _swapReadings = 0;
        _lastLiveStillInFixture = false;
        await _ctx.Announcer.AnnounceAsync(Announcement.Info(why), ct).ConfigureAwait(false);
    }

    // The larger of 25 ppm of the value and ten times the meter's reading noise at this NPLC.
    private double SwapThreshold(double value) =>
        Math.Max(SwapFloorPpm * 1e-6 * Math.Abs(value), 10 * _ctx.Plan.Decision.Nplc.NoisePpmOfRange * 1e-6 * _ctx.Plan.Range);
}
