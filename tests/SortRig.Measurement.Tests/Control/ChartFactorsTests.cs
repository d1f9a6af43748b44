using MathNet.Numerics.Distributions;
using SortRig.Measurement.Control;

namespace SortRig.Measurement.Tests.Control;

public sealed class ChartFactorsTests
{
    // Published table of control-chart factors: Montgomery, Introduction to Statistical Quality Control,
    // Appendix VI "Factors for constructing variables control charts" (same figures in ASTM E2587);
    // written here from memory, three decimals.  n, d2, d3, D3, D4
    public static TheoryData<int, double, double, double, double> Published =>
        new()
        {
            { 2, 1.128, 0.853, 0.000, 3.267 },
            { 3, 1.693, 0.888, 0.000, 2.574 },
            { 4, 2.059, 0.880, 0.000, 2.282 },
            { 5, 2.326, 0.864, 0.000, 2.114 },
            { 6, 2.534, 0.848, 0.000, 2.004 },
            { 7, 2.704, 0.833, 0.076, 1.924 },
            { 8, 2.847, 0.820, 0.136, 1.864 },
            { 9, 2.970, 0.808, 0.184, 1.816 },
            { 10, 3.078, 0.797, 0.223, 1.777 },
        };

    [Theory]
    [MemberData(nameof(Published))]
    public void Factors_MatchPublishedTable(int n, double d2, double d3, double bigD3, double bigD4)
    {
        Assert.Equal(d2, ChartFactors.D2(n), 3);
        Assert.Equal(d3, ChartFactors.LowerD3(n), 3);
        Assert.Equal(bigD3, ChartFactors.BigD3(n), 3);
        Assert.Equal(bigD4, ChartFactors.BigD4(n), 3);
    }

    [Theory]
    [MemberData(nameof(Published))]
    public void Factors_AgreeWithRangeDistributionOfNormalSamples(
        int n,
        double d2,
        double d3,
        double bigD3,
        double bigD4
    )
    {
        // Textbook identities (Tippett 1925; Montgomery ch. 6): for the range W of n standard normal values,
        // E[W] = integral of 1 - Phi(x)^n - (1 - Phi(x))^n dx, and
        // E[W^2] = 2 double-integral over x < y of 1 - Phi(y)^n - (1 - Phi(x))^n + (Phi(y) - Phi(x))^n.
        // d3 = sqrt(E[W^2] - E[W]^2); D3 = max(0, 1 - 3 d3 / d2); D4 = 1 + 3 d3 / d2.
        const double step = 0.02,
            lo = -8,
            hi = 8;
        int m = (int)((hi - lo) / step) + 1;
        var phi = new double[m];
        for (int i = 0; i < m; i++)
        {
            phi[i] = Normal.CDF(0, 1, lo + (i * step));
        }

        double mean = 0,
            second = 0;
        for (int i = 0; i < m; i++)
        {
            mean += Weight(i, m) * (1 - Math.Pow(phi[i], n) - Math.Pow(1 - phi[i], n));
        }

        mean *= step;
        for (int j = 0; j < m; j++)
        {
            double inner = 0;
            for (int i = 0; i <= j; i++)
            {
                double f = 1 - Math.Pow(phi[j], n) - Math.Pow(1 - phi[i], n) + Math.Pow(phi[j] - phi[i], n);
                inner += (i == 0 || i == j ? 0.5 : 1) * f; // trapezoid in x up to y
            }

            second += Weight(j, m) * inner * step;
        }

        second *= 2 * step;
        double computedD3 = Math.Sqrt(second - (mean * mean));
        Assert.Equal(d2, mean, 3);
        Assert.Equal(d3, computedD3, 3);
        Assert.Equal(bigD4, 1 + (3 * computedD3 / mean), 2);
        Assert.Equal(bigD3, Math.Max(0, 1 - (3 * computedD3 / mean)), 2);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(11)]
    public void D2_OutsideTable_Throws(int n) => Assert.Throws<ArgumentOutOfRangeException>(() => ChartFactors.D2(n));

    private static double Weight(int i, int m) => i == 0 || i == m - 1 ? 0.5 : 1;
}
