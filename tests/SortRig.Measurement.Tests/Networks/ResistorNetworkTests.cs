using MathNet.Numerics;
using SortRig.Measurement.Networks;

namespace SortRig.Measurement.Tests.Networks;

public sealed class ResistorNetworkTests
{
    [Fact]
    public void Parallel_TenPointZeroFiveAndTwentyPointOneKilohm_IsSixPointSevenKilohm()
    {
        // Arithmetic check, common practice: 10.05k × 20.1k / 30.15k = 6.7 kOhm.
        Assert.Equal(6_700.0, ResistorNetwork.Parallel(10_050, 20_100), 9);
    }

    [Fact]
    public void Series_IsTheSum()
    {
        // Textbook series formula R = R1 + R2 + R3.
        Assert.Equal(11_110.0, ResistorNetwork.Series(10_000, 1_000, 110), 9);
    }

    [Fact]
    public void Parallel_NEqualResistors_IsROverN()
    {
        // Textbook: n equal resistors in parallel give R/n; two in parallel give R1R2/(R1+R2).
        Assert.Equal(2_500.0, ResistorNetwork.Parallel(10_000, 10_000, 10_000, 10_000), 9);
        Assert.Equal(1_000.0 * 1_500.0 / 2_500.0, ResistorNetwork.Parallel(1_000, 1_500), 9);
    }

    [Fact]
    public void ParallelSensitivities_MatchMathNetNumericalDerivatives()
    {
        var parts = new ResistorEstimate[] { new(10_050, 0.02), new(20_100, 0.05), new(4_990, 0.01) };
        var result = ResistorNetwork.Parallel(parts);
        var x = parts.Select(p => p.Value).ToArray();
        double sum = 0;
        for (var i = 0; i < x.Length; i++)
        {
            // JCGM 100:2008 5.1.3: c_i = ∂f/∂x_i, here evaluated by MathNet's finite differences.
            var numeric = Differentiate.FirstPartialDerivative(v => ResistorNetwork.Parallel(v), x, i);
            Assert.Equal(numeric, result.Sensitivities[i], 6);
            sum += numeric * numeric * parts[i].StandardUncertainty * parts[i].StandardUncertainty;
        }

        // JCGM 100:2008 5.1.2, eq. (10) with the numerical coefficients.
        Assert.Equal(Math.Sqrt(sum), result.StandardUncertainty, 8);
    }

    [Fact]
    public void SeriesUncertainty_MatchesMathNetNumericalDerivatives()
    {
        var parts = new ResistorEstimate[] { new(10_000, 0.03), new(20_000, 0.04) };
        var result = ResistorNetwork.Series(parts);
        var x = parts.Select(p => p.Value).ToArray();
        var c0 = Differentiate.FirstPartialDerivative(v => ResistorNetwork.Series(v), x, 0);
        var c1 = Differentiate.FirstPartialDerivative(v => ResistorNetwork.Series(v), x, 1);
        Assert.Equal(30_000.0, result.Value, 9);
        Assert.Equal(Math.Sqrt((c0 * 0.03 * c0 * 0.03) + (c1 * 0.04 * c1 * 0.04)), result.StandardUncertainty, 9);
        // 3-4-5 triangle: √(0.03² + 0.04²) = 0.05 (hand arithmetic).
        Assert.Equal(0.05, result.StandardUncertainty, 12);
    }

    [Fact]
    public void Parallel_NonPositiveValue_ThrowsNamingTheResistor()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => ResistorNetwork.Parallel(10_000, 0));
        Assert.Contains("Resistor 1", ex.Message, StringComparison.Ordinal);
    }
}
