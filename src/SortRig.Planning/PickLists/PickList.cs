using SortRig.Planning.Networks;

namespace SortRig.Planning.PickLists;

/// <summary>Where a pick list's parts are found.</summary>
public enum PickSource
{
    /// <summary>Each part by id and slot (or location) — exact values known.</summary>
    Slots,

    /// <summary>Parts by cup and count — values known only to within the cup's band.</summary>
    Cups,
}

/// <summary>One part (or one pick from a cup) for one position.</summary>
/// <param name="Position">Position name.</param>
/// <param name="Build">"single", "series" or "parallel".</param>
/// <param name="PartId">Part number, or null when picked from a cup.</param>
/// <param name="Source">Slot label, part location or cup label; empty when unknown.</param>
/// <param name="Nominal">Marked nominal, ohms.</param>
/// <param name="Value">Measured value, ohms, or null when picked from a cup.</param>
public sealed record PickItem(
    string Position,
    string Build,
    long? PartId,
    string Source,
    double Nominal,
    double? Value
);

/// <summary>One set to pick.</summary>
/// <param name="Number">1-based set number.</param>
/// <param name="Items">What to pick, position by position (two items for a pair build).</param>
/// <param name="Outputs">Computed outputs and errors (for cups: bounds from the band widths).</param>
/// <param name="Score">Largest worst-case error over tolerance.</param>
public sealed record PickSet(
    int Number,
    IReadOnlyList<PickItem> Items,
    IReadOnlyList<OutputCheck> Outputs,
    double Score
);

/// <summary>What to pick for every set of a recipe.</summary>
/// <param name="RecipeName">Recipe name.</param>
/// <param name="Source">Slots or cups.</param>
/// <param name="Sets">The sets.</param>
/// <param name="UnusedPartIds">Parts in no set (empty for cups).</param>
public sealed record PickList(
    string RecipeName,
    PickSource Source,
    IReadOnlyList<PickSet> Sets,
    IReadOnlyList<long> UnusedPartIds
);
