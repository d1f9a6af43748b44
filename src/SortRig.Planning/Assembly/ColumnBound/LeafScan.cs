namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The best-first scan the network pricings share: leaves (fixed prefixes) in order of a proven lower bound on their
/// cheapest set, each judged until no later leaf can lower the minimum or add a wanted column. A leaf is judged in
/// full only when it could lower the minimum, or, up to a number of scans per round, while columns are still
/// wanted; otherwise its cheapest untried option stands as a lower bound (so the minimum stays a proven lower bound).
/// </summary>
internal static class LeafScan
{
    /// <param name="lower">(lower bound, prefix cost, leaf) for every leaf with some option.</param>
    /// <param name="maxColumns">Columns wanted.</param>
    /// <param name="maxScans">Full judgements allowed beyond those that could lower the minimum.</param>
    /// <param name="stop">True when time is up (then the result's minimum is NaN).</param>
    /// <param name="leafMin">(leaf, prefix cost, may scan) → (its minimum or lower bound, a set below it or null,
    /// whether it was judged in full).</param>
    public static PricingResult Run(
        List<(double Bound, double Prefix, int Leaf)> lower,
        int maxColumns,
        int maxScans,
        Func<bool> stop,
        Func<int, double, bool, (double Min, int[]? Set, bool Scanned)> leafMin
    )
    {
        lower.Sort((p, q) => p.Bound.CompareTo(q.Bound));
        var min = double.PositiveInfinity;
        var found = new List<(double Cost, int[] Parts)>();
        var scans = 0;
        for (var i = 0; i < lower.Count; i++)
        {
            var (bound, prefix, l) = lower[i];
            if (bound >= min && (bound >= 1 - 1e-9 || found.Count >= maxColumns))
            {
                // Every later leaf costs at least this: the minimum cannot fall, and no column can come from it or
                // enough are held.
                break;
            }

            if ((i & 255) == 0 && stop())
            {
                return new PricingResult(double.NaN, []);
            }

            var mayScan = bound < min || (found.Count < maxColumns && scans < maxScans);
            var (least, set, scanned) = leafMin(l, prefix, mayScan);
            scans += scanned ? 1 : 0;
            min = Math.Min(min, least);
            if (set is not null && least < 1 - 1e-9 && found.Count < 4 * maxColumns)
            {
                found.Add((least, set));
            }
        }

        return new PricingResult(min, MatchedPricing.Spread(found, maxColumns));
    }
}
