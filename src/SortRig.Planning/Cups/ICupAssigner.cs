using SortRig.Measurement.Uncertainty;

namespace SortRig.Planning.Cups;

/// <summary>A measured part waiting for a cup.</summary>
/// <param name="PartNumber">Part number, unique within a sorting session.</param>
/// <param name="Nominal">Marked nominal, ohms.</param>
/// <param name="Value">Accepted value with uncertainties.</param>
public sealed record CupRequest(long PartNumber, double Nominal, MeasuredValue Value);

/// <summary>Where a part goes.</summary>
/// <param name="CupLabel">Label shown to the operator ("A", "T1-A07", or "R" for reject).</param>
/// <param name="CupIndex">0-based index among the regular cups; the reject cup has index = number of regular
/// cups.</param>
/// <param name="IsReject">True for the reject cup.</param>
/// <param name="Reason">Why, in words (band limits, or why rejected).</param>
/// <param name="CompletesSet">True when this part makes the cup hold a whole number of sets' worth of this
/// nominal.</param>
public sealed record CupDecision(string CupLabel, int CupIndex, bool IsReject, string Reason, bool CompletesSet)
{
    /// <summary>
    /// True when <see cref="CupLabel"/> names a tray slot (the slot assigner's decisions, its reject bin included): the
    /// log keeps it as the part's slot. False (the default) for a shared cup, kept as the part's cup.
    /// </summary>
    public bool IsSlot { get; init; }
}

/// <summary>How many parts one cup holds.</summary>
/// <param name="Nominal">Nominal of the parts, ohms (0 for the reject cup of a multi-nominal planner).</param>
/// <param name="CupLabel">Cup label.</param>
/// <param name="CupIndex">0-based cup index (reject = number of regular cups).</param>
/// <param name="IsReject">True for the reject cup.</param>
/// <param name="Count">Parts in the cup.</param>
/// <param name="LowPpm">Lower band edge, ppm from nominal (NaN for reject and slots).</param>
/// <param name="HighPpm">Upper band edge, ppm from nominal (NaN for reject and slots).</param>
/// <param name="SetsReady">Whole sets' worth of this nominal in the cup.</param>
public sealed record CupCount(
    double Nominal,
    string CupLabel,
    int CupIndex,
    bool IsReject,
    int Count,
    double LowPpm,
    double HighPpm,
    int SetsReady
);

/// <summary>Tells the sorting pipeline which cup each measured part goes in.</summary>
public interface ICupAssigner
{
    /// <summary>Current content of every cup that holds parts (and of the reject cup).</summary>
    IReadOnlyList<CupCount> Counts { get; }

    /// <summary>Decides the cup of one part and records it.</summary>
    /// <exception cref="InvalidOperationException">The part number is already in a cup.</exception>
    CupDecision Assign(CupRequest request);

    /// <summary>Rebuilds the state after a restart from the recorded history, in the original order.</summary>
    /// <exception cref="ArgumentException">A label that this assigner never uses (or a slot used twice).</exception>
    /// <exception cref="InvalidOperationException">A part number appears twice.</exception>
    void Restore(IReadOnlyList<(CupRequest Part, string CupLabel)> history);

    /// <summary>Takes a part back out of its cup (the operator removed it).</summary>
    /// <exception cref="InvalidOperationException">The part is in no cup.</exception>
    void Undo(long partNumber);
}
