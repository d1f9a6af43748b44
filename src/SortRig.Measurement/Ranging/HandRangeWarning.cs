namespace SortRig.Measurement.Ranging;

/// <summary>What is wrong with a range set by hand.</summary>
public enum HandRangeWarningKind
{
    /// <summary>Parts of the batch would show overload on this range: the range cannot be used.</summary>
    Overflow = 0,

    /// <summary>A lower range shows the whole batch with more digits: usable, but coarser than it need be.</summary>
    LostDigit = 1,

    /// <summary>One digit is too coarse for the match band at a 4:1 ratio: usable, but cups blur.</summary>
    Coarse = 2,
}

/// <summary>One warning about a range set by hand, in plain words for the operator.</summary>
/// <param name="Kind">What is wrong.</param>
/// <param name="Text">What to tell the operator.</param>
public sealed record HandRangeWarning(HandRangeWarningKind Kind, string Text);
