using MathNet.Numerics.LinearAlgebra;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class CorrelatedAsymptoteBoundTests
{
    private static readonly RecoveryPath[] s_twoPaths = [new(0.6, 4.0, LogTimeConstantSd: 0.12), new(0.3, 0.9)];

    [Fact]
    public void WhiteNoise_EqualsTheWhiteBoundAtEveryCount()
    {
        // Referee: with no correlated component the filter's innovations are the columns themselves and their
        // variance is σ², so the information is GᵀG / σ², the white bound of the same readings (AsymptoteBound's
        // own definition, checked against the hand cases in AsymptoteBoundTests). The first few counts are nearly
        // singular (bounds of 10⁵ and more), where the order of summation shows in the fifth digit.
        var t = Enumerable.Range(0, 80).Select(k => 0.1 + (0.041 * k)).ToArray();

        var sequence = AsymptoteBound.Variances(t, s_twoPaths, ReadingNoise.White(0.007));

        for (var n = 1; n <= t.Length; n++)
        {
            var white = AsymptoteBound.Variance(t.AsSpan(0, n), s_twoPaths, 0.007);
            if (double.IsFinite(white))
            {
                Assert.Equal(white, sequence[n - 1], (n < 20 ? 1e-4 : 1e-8) * white);
            }
            else
            {
                Assert.Equal(double.PositiveInfinity, sequence[n - 1]);
            }
        }
    }

    [Theory]
    [InlineData(0.041, 120)]
    [InlineData(0.401, 25)]
    public void CorrelatedNoise_EqualsTheDenseGeneralisedLeastSquaresInformation(double spacing, int n)
    {
        // Referee: the Fisher information of Gaussian readings of covariance Σ is Gᵀ Σ⁻¹ G (Kay 1993, Fundamentals of
        // Statistical Signal Processing vol. 1, sec. 3.9, from memory). Σ is written out densely (σ² on the diagonal,
        // Σ v exp(−|tᵢ − tⱼ| / θ) everywhere) and solved with MathNet's Cholesky; the bound is the (0, 0) element of
        // the inverse after the prior's 1 / sd² is added to the body's ln τ.
        var t = Enumerable.Range(0, n).Select(k => 0.3 + (spacing * k)).ToArray();
        CorrelatedNoise[] parts = [new(2e-5, 0.1), new(2e-5, 1), new(2e-5, 10), new(2e-5, 100)];
        var noise = new ReadingNoise(0.007, parts);

        var sequence = AsymptoteBound.Variances(t, s_twoPaths, noise);

        var sigma = Matrix<double>.Build.Dense(n, n, (i, j) =>
            (i == j ? 0.007 * 0.007 : 0)
            + parts.Sum(c => c.Variance * Math.Exp(-Math.Abs(t[i] - t[j]) / c.CorrelationTime))
        );
        var g = Matrix<double>.Build.Dense(n, 5, (i, j) => j switch
            {
                0 => 1,
                1 => Math.Exp(-t[i] / 4.0),
                2 => 0.6 * (t[i] / 4.0) * Math.Exp(-t[i] / 4.0),
                3 => Math.Exp(-t[i] / 0.9),
                _ => 0.3 * (t[i] / 0.9) * Math.Exp(-t[i] / 0.9),
            });
        var info = g.TransposeThisAndMultiply(sigma.Cholesky().Solve(g));
        info[2, 2] += 1 / (0.12 * 0.12);
        var dense = info.Inverse()[0, 0];

        Assert.Equal(dense, sequence[^1], 1e-6 * dense);
    }

    [Fact]
    public void CorrelatedNoise_NeverLowersTheBoundOfItsWhitePart()
    {
        // Common practice, no source: adding independent noise to the readings cannot add information (the
        // information-processing inequality), so the bound with the components is at least the white part's alone,
        // and it still never grows as readings are added.
        var t = Enumerable.Range(0, 150).Select(k => 0.1 + (0.041 * k)).ToArray();
        var noise = new ReadingNoise(0.007, [new CorrelatedNoise(4e-5, 0.1), new CorrelatedNoise(4e-5, 1)]);

        var correlated = AsymptoteBound.Variances(t, s_twoPaths, noise);
        var white = AsymptoteBound.Variances(t, s_twoPaths, ReadingNoise.White(0.007));

        for (var i = 10; i < t.Length; i++)
        {
            Assert.True(correlated[i] >= white[i] * (1 - 1e-9), $"reading {i}: {correlated[i]} < {white[i]}");
            Assert.True(correlated[i] <= correlated[i - 1] * (1 + 1e-9), $"reading {i} grew");
        }

        Assert.True(correlated[^1] > 1.05 * white[^1]);
    }
}
