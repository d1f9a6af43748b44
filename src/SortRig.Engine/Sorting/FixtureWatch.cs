using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Engine.Sorting;

/// <summary>
/// Watches the fixture through the reading stream, before the settle rule: a stall (the readings stopped while a part
/// settled), time the meter could not deliver readings in (excused), and a part swapped unseen (after a broken stream,
/// while waiting for the decided part to be taken out). Pure: no I/O, no clock (times come from the readings); the loop
/// applies its verdicts to the settle tracker and tells the operator.
/// </summary>
/// <param name="readingPeriod">Time between two readings at the batch's NPLC.</param>
/// <param name="stallGap">A gap between readings of a settling part longer than this is a stall.</param>
/// <param name="swapThreshold">Distance from the decided value (ohms, given the value) beyond which a reading is
/// another part.</param>
internal sealed class FixtureWatch(TimeSpan readingPeriod, TimeSpan stallGap, Func<double, double> swapThreshold)
{
    // Readings in a row, all far from the part just decided, that mean another part is in the fixture.
    private const int SwapEvidence = 2;

    // After a broken stream, a part that reads like the decided one and is still in the fixture this
    // long after readings resumed is taken for a new part: the operator takes an announced part out
    // within seconds (our choice; a person who really left it in hears a new number and presses U).
    private static readonly TimeSpan s_stillThere = TimeSpan.FromSeconds(20);

    private DateTimeOffset? _lastReadingTime;
    private bool _gapIsFault;
    private double? _decidedValue;
    private DateTimeOffset? _ambiguousSince;
    private bool _streamBroken;
    private int _swapReadings;

    /// <summary>
    /// A meter fault cut the readings off. The gap that follows is the fault's (excused, never a stall); and when the
    /// loop waited for the decided part to be taken out, the operator may have swapped parts meanwhile.
    /// </summary>
    public void NoteStreamBroken(SettleState state)
    {
        _gapIsFault = _lastReadingTime is not null;
        if (state == SettleState.AwaitingRemoval)
        {
            _streamBroken = true;
            _swapReadings = 0;
        }
    }

    /// <summary>A part was decided (accepted or unstable) at this value.</summary>
    public void NoteDecided(double value)
    {
        _decidedValue = value;
        _streamBroken = false;
        _ambiguousSince = null;
        _swapReadings = 0;
    }

    /// <summary>The stall check, first for each reading; <paramref name="state"/> is the tracker's before the
    /// reading.</summary>
    public FixtureVerdict CheckStall(Reading reading, SettleState state)
    {
        var gap = reading.Time - (_lastReadingTime ?? reading.Time);
        var fault = _gapIsFault;
        _lastReadingTime = reading.Time;
        _gapIsFault = false;

        // Waiting for removal, a gap of more than two reading periods is long enough for a quick
        // hand to take the part out and put the next one in unseen.
        if (!fault && gap > 2 * readingPeriod && state == SettleState.AwaitingRemoval)
        {
            _streamBroken = true;
        }

        if (!state.IsBusy() || gap <= 2 * readingPeriod)
        {
            return default;
        }

        // Time the meter could not deliver readings in (an outage, a slow host) is not time the part
        // failed to settle in: the settle limit counts only time with readings coming.
        return !fault && gap > stallGap
            ? new FixtureVerdict(
                FixtureAction.Remeasure,
                Message: FormattableString.Invariant($"no reading for {gap.TotalSeconds:0} s: measuring the part again")
            )
            : new FixtureVerdict(FixtureAction.Excuse, gap - readingPeriod);
    }

    /// <summary>
    /// The swap check, after the stall check's verdict was applied: readings far from the decided part's value (twice
    /// in a row, so one garbled reply is not enough) are a new part; so is a part that reads like it but stays in the
    /// fixture (values alone cannot tell two parts closer than the threshold apart).
    /// </summary>
    /// <param name="reading">The reading.</param>
    /// <param name="state">The tracker's state now.</param>
    /// <param name="lastLive">The last part announced (number and cup), named in the message; null if none.</param>
    public FixtureVerdict CheckSwap(Reading reading, SettleState state, (int Number, string? Cup)? lastLive)
    {
        // One overload is not yet a removal (the tracker wants two in a row), but it shows the contact
        // opened: a quick hand may have changed the part within one reading period.
        if (state == SettleState.AwaitingRemoval && !reading.IsFinite)
        {
            _streamBroken = true;
        }

        if (!_streamBroken || state != SettleState.AwaitingRemoval || _decidedValue is not { } decided)
        {
            _streamBroken = false;
            _ambiguousSince = null;
            return default;
        }

        _ambiguousSince ??= reading.Time;
        if (!reading.IsFinite)
        {
            _swapReadings = 0;
            return default;
        }

        string? why = null;
        if (Math.Abs(reading.Value - decided) > swapThreshold(decided))
        {
            why =
                ++_swapReadings >= SwapEvidence
                    ? "a new part went in before the fixture was seen empty: measuring it"
                    : null;
        }
        else
        {
            _swapReadings = 0;
            why =
                reading.Time - _ambiguousSince.Value > s_stillThere
                    ? "a part is still in the fixture after the meter came back: measuring it as a new part"
                        + (
                            lastLive is { } last
                                ? $" (if it is part {last.Number}, put it in cup {last.Cup} and press U)"
                                : ""
                        )
                    : null;
        }

        if (why is null)
        {
            return default;
        }

        _streamBroken = false;
        _ambiguousSince = null;
        _swapReadings = 0;
        return new FixtureVerdict(FixtureAction.NewPart, Message: why);
    }
}
