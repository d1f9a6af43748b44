namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>One pricing answer.</summary>
/// <param name="Min">A proven lower bound on min Σ_{i∈S} y_i over the family; +∞ when the family is empty; NaN when
/// stopped.</param>
/// <param name="Columns">Sets of the family (part indices) with Σ y below 1, cheapest first.</param>
internal sealed record PricingResult(double Min, IReadOnlyList<int[]> Columns);
