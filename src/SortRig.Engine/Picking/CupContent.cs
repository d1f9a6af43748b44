using SortRig.Planning.Cups;

namespace SortRig.Engine.Picking;

/// <summary>One cup as the pick list sees it: its content and its members, lowest id first.</summary>
/// <param name="Count">Planning cup count, nominal snapped to the recipe's, band from the members' values.</param>
/// <param name="Members">Part ids in the cup, ascending.</param>
internal sealed record CupContent(CupCount Count, IReadOnlyList<long> Members);
