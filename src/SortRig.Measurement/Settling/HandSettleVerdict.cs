using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>Where a part read by a person stands after an entry.</summary>
public enum HandSettleState
{
    /// <summary>Fewer than K entries so far: read again.</summary>
    Confirming = 0,

    /// <summary>The entry came sooner than the least gap after the last one; not counted.</summary>
    TooSoon = 1,

    /// <summary>The last K entries do not agree: the part is still warm from the fingers; read again.</summary>
    Moving = 2,

    /// <summary>The last K entries agree: the part is accepted (reported once).</summary>
    Accepted = 3,

    /// <summary>Still moving after the most entries allowed (reported once).</summary>
    Unstable = 4,
}

/// <summary>The settle rule's verdict on one typed entry.</summary>
/// <param name="State">Where the part stands.</param>
/// <param name="Prompt">What to tell the operator next, in plain words.</param>
/// <param name="Counted">Entries counted for this part so far.</param>
/// <param name="Value">When accepted: the mean of the agreeing entries with its uncertainty from the range's
/// spec.</param>
/// <param name="Entries">When accepted or unstable: every counted entry of the part, oldest first.</param>
public sealed record HandSettleVerdict(
    HandSettleState State,
    string Prompt,
    int Counted,
    MeasuredValue? Value = null,
    IReadOnlyList<Reading>? Entries = null
);
