namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// Type B evaluation of standard uncertainty from an assumed distribution (JCGM 100:2008 sec. 4.3).
/// Every half-width is in the unit of the quantity and must be finite and &gt;= 0.
/// </summary>
public static class TypeB
{
    private static readonly double s_sqrt3 = Math.Sqrt(3.0);
    private static readonly double s_sqrt6 = Math.Sqrt(6.0);

    /// <summary>Rectangular distribution of half-width a: u = a/√3 (JCGM 100:2008 4.3.7, eq. 7).</summary>
    public static double Rectangular(double halfWidth) => Check(halfWidth, nameof(halfWidth)) / s_sqrt3;

    /// <summary>Symmetric triangular distribution of half-width a: u = a/√6 (JCGM 100:2008 4.3.9).</summary>
    public static double Triangular(double halfWidth) => Check(halfWidth, nameof(halfWidth)) / s_sqrt6;

    /// <summary>
    /// Standard uncertainty from a quoted expanded uncertainty and its coverage factor: u = U/k
    /// (JCGM 100:2008 4.3.3). <paramref name="coverageFactor"/> must be &gt; 0.
    /// </summary>
    public static double FromExpanded(double expanded, double coverageFactor)
    {
        Check(expanded, nameof(expanded));
        if (!(coverageFactor > 0) || !double.IsFinite(coverageFactor))
        {
            throw new ArgumentOutOfRangeException(
                nameof(coverageFactor),
                coverageFactor,
                "Coverage factor k must be finite and > 0."
            );
        }

        return expanded / coverageFactor;
    }

    private static double Check(double value, string name) =>
        double.IsFinite(value) && value >= 0
            ? value
            : throw new ArgumentOutOfRangeException(name, value, "Half-width must be finite and >= 0.");
}
