using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Bench.Settling;

/// <summary>
/// The fixed-delay rule: contact is the first finite reading; wait a fixed delay; the value is the mean of the next
/// 10 readings (apertures starting at least the delay after contact), with the same uncertainty budget as an
/// accepted window (Type A, resolution, short-term stability) and no settling term.
/// </summary>
internal static class FixedDelayRule
{
    public const int Averaged = 10;

    public static RuleOutcome Run(Insertion insertion, RangeSpec range, NplcSpec nplc, bool fourWire, TimeSpan delay)
    {
        var contact = 0;
        while (!insertion.Reading(contact).IsFinite)
        {
            contact++;
        }

        var first = insertion.FirstEndingAtOrAfter(insertion.Since(contact) + delay + insertion.Period);
        var window = new Reading[Averaged];
        for (var i = 0; i < Averaged; i++)
        {
            window[i] = insertion.Reading(first + i);
        }

        if (window.Any(r => !r.IsFinite))
        {
            return RuleOutcome.Unstable(insertion.Since(first + Averaged - 1).TotalSeconds, Averaged + 1);
        }

        var value = ResistanceUncertainty.For(window, range, nplc, SpecPeriod.Year1, fourWire);
        // The meter may idle while the rule waits: one reading to see the contact, then the averaged ones.
        return RuleOutcome.Measured(
            insertion.Since(first + Averaged - 1).TotalSeconds,
            Averaged + 1,
            value.Value,
            value.ExpandedTransfer,
            value.Expanded,
            insertion.Truth
        );
    }
}
