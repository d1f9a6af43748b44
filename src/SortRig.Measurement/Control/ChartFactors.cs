namespace SortRig.Measurement.Control;

/// <summary>
/// Control-chart factors for subgroups (or moving ranges) of n = 2..10 normal observations:
/// d2 = E[range] / sigma, d3 = sd[range] / sigma, D3 = max(0, 1 - 3 d3 / d2), D4 = 1 + 3 d3 / d2.
/// Values as printed in the usual table of factors (Montgomery, Introduction to Statistical Quality
/// Control, Appendix VI; the same figures appear in ASTM E2587), three decimals.
/// </summary>
public static class ChartFactors
{
    /// <summary>Smallest subgroup size in the table.</summary>
    public const int MinSize = 2;

    /// <summary>Largest subgroup size in the table.</summary>
    public const int MaxSize = 10;

    // index = n - 2
    private static readonly double[] s_d2 = [1.128, 1.693, 2.059, 2.326, 2.534, 2.704, 2.847, 2.970, 3.078];
    private static readonly double[] s_d3 = [0.853, 0.888, 0.880, 0.864, 0.848, 0.833, 0.820, 0.808, 0.797];
    private static readonly double[] s_bigD3 = [0, 0, 0, 0, 0, 0.076, 0.136, 0.184, 0.223];
    private static readonly double[] s_bigD4 = [3.267, 2.574, 2.282, 2.114, 2.004, 1.924, 1.864, 1.816, 1.777];

    /// <summary>d2: mean range of n normal observations in units of sigma.</summary>
    /// <param name="n">Subgroup size, [2, 10].</param>
    public static double D2(int n) => s_d2[Index(n)];

    /// <summary>d3: standard deviation of the range of n normal observations in units of sigma.</summary>
    /// <param name="n">Subgroup size, [2, 10].</param>
    public static double LowerD3(int n) => s_d3[Index(n)];

    /// <summary>D3: the range chart's lower limit is D3 times the mean range.</summary>
    /// <param name="n">Subgroup size, [2, 10].</param>
    public static double BigD3(int n) => s_bigD3[Index(n)];

    /// <summary>D4: the range chart's upper limit is D4 times the mean range.</summary>
    /// <param name="n">Subgroup size, [2, 10].</param>
    public static double BigD4(int n) => s_bigD4[Index(n)];

    private static int Index(int n)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(n, MinSize);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(n, MaxSize);
        return n - MinSize;
    }
}
