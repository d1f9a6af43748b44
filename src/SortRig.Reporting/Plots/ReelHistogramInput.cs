namespace SortRig.Reporting.Plots;

/// <summary>What to draw for one reel (parts of one nominal value).</summary>
/// <param name="NominalOhms">Nominal resistance, ohms; finite and &gt; 0. Deviations are in ppm of it.</param>
/// <param name="ValuesOhms">Accepted values of the parts, ohms; at least one, all finite.</param>
/// <param name="TolerancePercent">Stock tolerance, percent (1 for a 1 % reel); null to draw no limits.</param>
/// <param name="CupEdgesPpm">Band/cup boundaries in ppm of nominal, drawn as dashed vertical lines; may be
/// empty.</param>
/// <param name="BinWidthPpm">Histogram bin width, ppm; null to choose a 1-2-5 width giving about sqrt(n) bins
/// (8..50).</param>
public sealed record ReelHistogramInput(
    double NominalOhms,
    IReadOnlyList<double> ValuesOhms,
    double? TolerancePercent,
    IReadOnlyList<double> CupEdgesPpm,
    double? BinWidthPpm = null
);

/// <summary>The numbers behind a reel histogram.</summary>
/// <param name="NominalOhms">Nominal, ohms.</param>
/// <param name="DeviationsPpm">Each part's deviation from nominal, ppm, in input order.</param>
/// <param name="BinEdgesPpm">Bin edges, ppm; bin i is [edge i, edge i+1). One more edge than counts.</param>
/// <param name="Counts">Parts per bin; sums to the number of parts.</param>
/// <param name="ToleranceLimitsPpm">-tol and +tol in ppm, or empty.</param>
/// <param name="CupEdgesPpm">Cup edges drawn, ppm.</param>
public sealed record ReelHistogramData(
    double NominalOhms,
    double[] DeviationsPpm,
    double[] BinEdgesPpm,
    int[] Counts,
    double[] ToleranceLimitsPpm,
    double[] CupEdgesPpm
);
