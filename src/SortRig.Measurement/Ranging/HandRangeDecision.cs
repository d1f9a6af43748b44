using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Ranging;

/// <summary>The range rule's verdict on a range for a meter read by eye.</summary>
/// <param name="Range">The range judged (the one set on the meter, or the recommended one).</param>
/// <param name="Recommended">The lowest range that shows every part of the batch.</param>
/// <param name="Warnings">Empty when the range is the recommended one and fine for the match.</param>
public sealed record HandRangeDecision(
    DisplayRange Range,
    DisplayRange Recommended,
    IReadOnlyList<HandRangeWarning> Warnings
)
{
    /// <summary>False when parts would overflow the range: the operator must set another.</summary>
    public bool Usable => Warnings.All(w => w.Kind != HandRangeWarningKind.Overflow);

    /// <summary>What to tell the operator before the first part: which range to set, by hand.</summary>
    public string Instruction =>
        $"set the meter to the {Recommended.Name} range (it shows up to {Recommended.Show(Recommended.DisplayMax)}, "
        + $"one digit = {Recommended.Show(Recommended.Step)})";
}
