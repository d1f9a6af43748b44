using MathNet.Numerics.LinearAlgebra;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class ExponentialFitterTests
{
    [Theory]
    [InlineData(10_000, 0.5, 4.0, 0.5)]
    [InlineData(10_000, -0.8, 2.5, 0.041)]
    [InlineData(100, 0.004, 7.0, 1.0)]
    public void One_ThreeEquallySpacedNoiseFreePoints_RecoversAitkenAsymptote(double a, double b, double tau, double h)
    {
        // Textbook identity (Aitken's delta-squared): for y_k = A + B r^k at equal spacing,
        // A = (y0 y2 - y1^2) / (y0 + y2 - 2 y1) = y2 - (y2 - y1)^2 / ((y2 - y1) - (y1 - y0)) (the second form, same
        // algebra, avoids cancellation in y0 y2 - y1^2).
        double[] t = [0, h, 2 * h];
        var y = t.Select(x => a + (b * Math.Exp(-x / tau))).ToArray();
        var aitken = y[2] - (Math.Pow(y[2] - y[1], 2) / ((y[2] - y[1]) - (y[1] - y[0])));
        var relative = y.Select(v => v - y[2]).ToArray();

        var fit = ExponentialFitter.One(t, relative, 0.02, 60, 0, tolerance: 1e-10);

        Assert.Equal(a, aitken, 1e-7 * a);
        Assert.Equal(aitken, fit.Final + y[2], 1e-7 * a);
        Assert.Equal(tau, fit.TimeConstants[0], 1e-5 * tau);
        Assert.True(fit.Converged);
    }

    [Fact]
    public void One_NoiseFreeRecord_ZeroResidualAndParametersBack()
    {
        var t = Enumerable.Range(0, 100).Select(k => 0.05 * k).ToArray();
        var y = t.Select(x => 0.3 * Math.Exp(-x / 3.2)).ToArray();

        var fit = ExponentialFitter.One(t, y, 0.02, 60, 0, tolerance: 1e-10);

        Assert.Equal(0, fit.Final, 1e-9);
        Assert.Equal(0.3, fit.Amplitudes[0], 1e-8);
        Assert.Equal(3.2, fit.TimeConstants[0], 1e-7);
        Assert.Equal(0, fit.Rss, 1e-15);
    }

    [Fact]
    public void Two_NoiseFreeSumOfTwoDecays_RecoversTheAsymptoteWhereOneExponentialCannot()
    {
        // A fast path (0.8 s) and a slow one (4 s), as a part cooling through its leads and its body.
        var t = Enumerable.Range(0, 120).Select(k => 0.041 * k).ToArray();
        var y = t.Select(x => (0.2 * Math.Exp(-x / 0.8)) + (0.5 * Math.Exp(-x / 4))).ToArray();

        var two = ExponentialFitter.Two(t, y, 0.02, 60, 0, tolerance: 1e-10);
        var one = ExponentialFitter.One(t, y, 0.02, 60, 0);

        Assert.Equal(0, two.Final, 2e-4);
        Assert.Equal(0.8, two.TimeConstants[0], 0.01);
        Assert.Equal(4.0, two.TimeConstants[1], 0.05);
        Assert.True(two.Aicc < one.Aicc);
        Assert.True(Math.Abs(one.Final) > 10 * Math.Abs(two.Final));
    }

    [Fact]
    public void One_NoisyRecord_StatedUncertaintyCoversTheError()
    {
        // Over many seeded records the asymptote's error divided by its stated standard uncertainty should have
        // unit spread (least-squares covariance, large-sample theory); accept 0.7 to 1.4 over 400 records.
        var t = Enumerable.Range(0, 80).Select(k => 0.05 * k).ToArray();
        var z = new List<double>();
        for (var seed = 0; seed < 400; seed++)
        {
            var noise = ReadingScript.Gaussian(seed, 0.01);
            var y = t.Select(x => (1.0 * Math.Exp(-x / 2.0)) + noise()).ToArray();
            var fit = ExponentialFitter.One(t, y, 0.02, 60, 0);
            z.Add(fit.Final / Math.Sqrt(fit.VarianceOfFinal));
        }

        var spread = Math.Sqrt(z.Select(v => v * v).Average());
        Assert.InRange(spread, 0.7, 1.4);
    }

    [Theory]
    // Two-sided normal quantiles z at 1 − 0.05 / (2 × looks), squared (standard normal table, e.g. Abramowitz and
    // Stegun table 26.1, from memory): one look, z(0.975) = 1.95996; 12.5 looks, z(0.998) = 2.87816; 20 looks,
    // z(0.99875) = 3.02334.
    [InlineData(1, 3.8415)]
    [InlineData(12.5, 8.2838)]
    [InlineData(20, 9.1406)]
    public void Threshold_ForManyDegreesOfFreedom_IsTheBonferroniNormalQuantileSquared(double looks, double expected)
    {
        Assert.Equal(expected, ExponentialFitter.Threshold(1_000_000, looks), 0.002);
    }

    [Fact]
    public void Profile_AtOneFixedTimeConstant_IsTheLinearLeastSquaresInterval()
    {
        // With τ fixed the model A + B e^(−t/τ) is linear: the profile interval of A is Â ± √(χ² s² [(XᵀX)⁻¹]₀₀)
        // (linear least squares, Draper and Smith ch. 2, from memory); reference solution from MathNet's QR.
        var t = Enumerable.Range(0, 60).Select(k => 0.05 * k).ToArray();
        var noise = ReadingScript.Gaussian(7, 0.01);
        var y = t.Select(x => 0.4 + (0.3 * Math.Exp(-x / 2.0)) + noise()).ToArray();
        var fit = ExponentialFitter.One(t, y, 2.0, 2.0, 0);
        var x = Matrix<double>.Build.Dense(t.Length, 2, (i, j) => j == 0 ? 1 : Math.Exp(-t[i] / 2.0));
        var beta = x.QR().Solve(Vector<double>.Build.DenseOfArray(y));
        var c = (x.TransposeThisAndMultiply(x)).Inverse()[0, 0];
        var s2 = 1.3e-4;

        var (low, high) = ExponentialFitter.ProfileInterval(t, y, fit, s2, 2.0, 2.0);

        var half = Math.Sqrt(ExponentialFitter.Threshold(t.Length - 3) * s2 * c);
        // t² → χ²₁ as ν grows (textbook identity: F(1, ∞) = χ²₁).
        Assert.Equal(ExponentialFitter.ChiSquareThreshold, ExponentialFitter.Threshold(1_000_000), 0.002);
        Assert.Equal(beta[0] - half, low, 1e-9);
        Assert.Equal(beta[0] + half, high, 1e-9);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void Profile_ShortRecordOfTwoPaths_CoversTheAsymptoteOneExponentialMisses(int seed)
    {
        // A part cooling through its leads (0.8 s) and its body (4 s), seen for 1.4 s at 0.5 ppm noise of 10 kOhm:
        // one exponential fits the record (tau near 1 s) but extrapolates far short of the slow tail. The profile of A
        // over two exponentials (slowest tau bounded by 5 s) must still hold the true asymptote, 0.
        var t = Enumerable.Range(0, 35).Select(k => 0.041 * k).ToArray();
        var noise = ReadingScript.Gaussian(seed, 0.005);
        var y = t.Select(x => (0.2 * Math.Exp(-x / 0.8)) + (0.5 * Math.Exp(-x / 4)) + noise()).ToArray();
        var one = ExponentialFitter.One(t, y, 0.02, 5, 0);
        var two = ExponentialFitter.Two(t, y, 0.02, 5, 0);
        var s2 = two.Rss / (two.Count - two.Parameters);

        var (low, high) = ExponentialFitter.ProfileInterval(t, y, two, s2, 0.02, 5);

        Assert.True(Math.Abs(one.Final) > 0.1, $"one exponential predicted {one.Final}");
        Assert.InRange(0, low, high);
    }

    [Fact]
    public void RunsTest_FourUpFourDown_MatchesHandDerivedZ()
    {
        // Wald-Wolfowitz: n1 = n2 = 4, R = 2: mu = 2*16/8 + 1 = 5, var = 32 (32 - 8) / (64 * 7) = 12/7, z = -3 /
        // sqrt(12/7).
        double[] residuals = [1, 1, 1, 1, -1, -1, -1, -1];

        Assert.Equal(-3 / Math.Sqrt(12.0 / 7), RunsTest.Z(residuals), 12);
        Assert.Equal(0.0, RunsTest.Z([1, -1, 1, -1, 1, -1, 1, -1]) - ((8 - 5) / Math.Sqrt(12.0 / 7)), 12);
    }
}
