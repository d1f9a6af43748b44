namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Pricing of the column bound: over a family of part sets that contains every feasible set, the smallest sum of part
/// duals (or a proven lower bound on it), and some sets of the family whose sum is below 1.
/// </summary>
internal interface IColumnPricing
{
    /// <summary>What the priced family is, in words.</summary>
    string Family { get; }

    /// <summary>Prices; the result's minimum is NaN when <paramref name="stop"/> cut it short.</summary>
    PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop);
}
