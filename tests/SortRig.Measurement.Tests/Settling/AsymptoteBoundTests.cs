using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class AsymptoteBoundTests
{
    [Theory]
    [InlineData(4.0, 0.041, 50, 0.007)]
    [InlineData(3.2, 0.401, 12, 0.0025)]
    [InlineData(0.6, 0.1, 30, 1.0)]
    public void KnownTimeConstant_EqualsTheInterceptVarianceOfTheStraightLineFit(
        double tau,
        double spacing,
        int n,
        double sigma
    )
    {
        // Referee: with τ known, y = final + a·x with x = exp(−t/τ) is a straight line in x; the least-squares
        // intercept has variance σ² Σx² / (n Σx² − (Σx)²) (the textbook straight-line fit, e.g. Draper & Smith,
        // Applied Regression Analysis, ch. 1), and for a linear model with Gaussian noise the bound is attained.
        var t = Enumerable.Range(0, n).Select(k => 0.05 + (spacing * k)).ToArray();
        var x = t.Select(v => Math.Exp(-v / tau)).ToArray();
        var sx = x.Sum();
        var sxx = x.Sum(v => v * v);
        var hand = sigma * sigma * sxx / ((n * sxx) - (sx * sx));

        var bound = AsymptoteBound.Variance(t, [new RecoveryPath(0.8, tau, TimeConstantKnown: true)], sigma);

        Assert.Equal(hand, bound, 1e-9 * hand);
    }

    [Theory]
    [InlineData(0.5, 4.0, 0.5, 0.01)]
    [InlineData(-0.8, 2.5, 1.0, 0.003)]
    [InlineData(0.05, 7.0, 2.0, 0.0007)]
    public void ThreeEquallySpacedPoints_EqualsTheLinearisedVarianceOfAitkensAsymptote(
        double a,
        double tau,
        double h,
        double sigma
    )
    {
        // Referee: three readings determine (final, a, τ) exactly, and the final value is then Aitken's
        // delta-squared, F(y) = (y0 y2 − y1²) / (y0 + y2 − 2 y1) (textbook identity); for an exactly determined model
        // the bound is σ² |∇F|² at the noise-free readings (the delta method; the Fisher matrix is GᵀG / σ² with G
        // invertible). ∇F by hand: with N = y0 y2 − y1², D = y0 + y2 − 2 y1,
        // ∂F/∂y0 = (y2 D − N) / D², ∂F/∂y1 = 2 (N − y1 D) / D², ∂F/∂y2 = (y0 D − N) / D².
        double[] t = [0, h, 2 * h];
        var y = t.Select(v => 10 + (a * Math.Exp(-v / tau))).ToArray();
        var num = (y[0] * y[2]) - (y[1] * y[1]);
        var den = y[0] + y[2] - (2 * y[1]);
        double[] grad =
        [
            ((y[2] * den) - num) / (den * den),
            2 * (num - (y[1] * den)) / (den * den),
            ((y[0] * den) - num) / (den * den),
        ];
        var hand = sigma * sigma * grad.Sum(v => v * v);

        var bound = AsymptoteBound.Variance(t, [new RecoveryPath(a, tau)], sigma);

        Assert.Equal(hand, bound, 1e-6 * hand);
    }

    [Fact]
    public void TwoFreePaths_NeedFiveReadingsAndNeverGrowWithMore()
    {
        // Common practice, no source: five parameters need five readings; each reading adds a positive semi-definite
        // term to the Fisher information, so the bound cannot grow as readings are added.
        var t = Enumerable.Range(0, 200).Select(k => 0.1 + (0.041 * k)).ToArray();
        RecoveryPath[] paths = [new(0.6, 4.0), new(0.3, 0.9)];

        Assert.Equal(double.PositiveInfinity, AsymptoteBound.Variance(t.AsSpan(0, 4), paths, 0.007));
        var previous = double.PositiveInfinity;
        for (var n = 20; n <= t.Length; n += 20)
        {
            var v = AsymptoteBound.Variance(t.AsSpan(0, n), paths, 0.007);
            Assert.True(v <= previous * (1 + 1e-9), $"n = {n}: {v} after {previous}");
            previous = v;
        }
    }

    [Fact]
    public void PriorOnTheTimeConstant_LiesBetweenUnknownAndKnown()
    {
        // Van Trees (Detection, Estimation and Modulation Theory I, 1968, 2.4): prior information adds to the data's;
        // a vanishing prior sd tends to the known-τ bound, an infinite one is the classical bound.
        var t = Enumerable.Range(0, 60).Select(k => 0.1 + (0.05 * k)).ToArray();
        var free = AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0)], 0.007);
        var wide = AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0, LogTimeConstantSd: 1e6)], 0.007);
        var tight = AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0, LogTimeConstantSd: 1e-7)], 0.007);
        var mid = AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0, LogTimeConstantSd: 0.12)], 0.007);
        var known = AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0, TimeConstantKnown: true)], 0.007);

        Assert.Equal(free, wide, 1e-6 * free);
        Assert.Equal(known, tight, 1e-4 * known);
        Assert.InRange(mid, known, free);
        Assert.True(free > 10 * known);
    }

    [Fact]
    public void ReadingsAllAtOneInstant_DoNotDetermineTheFinalValue()
    {
        // Common practice, no source: readings at one instant carry no information on the curve's shape, so the final
        // value is not determined (a singular information matrix), however many there are.
        var t = Enumerable.Repeat(1.5, 40).ToArray();

        Assert.Equal(double.PositiveInfinity, AsymptoteBound.Variance(t, [new RecoveryPath(0.5, 4.0)], 0.007));
        Assert.True(double.IsFinite(AsymptoteBound.Variance([1.5, 2.5, 3.5], [new RecoveryPath(0.5, 4.0)], 0.007)));
    }
}
