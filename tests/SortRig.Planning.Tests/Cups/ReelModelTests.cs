using MathNet.Numerics.Distributions;
using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

public sealed class ReelModelTests
{
    private const double Lo = -10_000;
    private const double Hi = 10_000;
    private static readonly (double, double) s_weakPrior = (3333, 0.01);

    [Fact]
    public void LogLikelihood_MatchesAHandComputedTruncatedNormal()
    {
        // x = {2, −3}, N(0.5, 2) on [−10, 10] without |x| < 1: Σ ln φ − 2 ln Z, Z = P(−10 ≤ X ≤ −1) + P(1 ≤ X ≤ 10)
        // = 0.62791993..., worked by hand with Python's math.erf (Φ(z) = (1 + erf(z/√2))/2): −4.1059861975862.
        var l = ReelModel.LogLikelihood([2, -3], -10, 10, 1, 0.5, 2);

        Assert.Equal(-4.105986197586245, l, 9);
        Assert.Equal(double.NegativeInfinity, ReelModel.LogLikelihood([0.5], -10, 10, 1, 0.5, 2));
    }

    [Fact]
    public void Fit_RecoversANormalReel_WithoutAHole()
    {
        // Referee: MathNet's normal sampler, N(300, 3000) kept within the tolerance; 400 parts give μ, σ to a few
        // percent of σ (standard error σ/√n = 150 for μ).
        var x = Draw(new Normal(300, 3000, new Random(7)), 400, gap: 0);

        var model = ReelModel.Fit(x, Lo, Hi, s_weakPrior);

        Assert.Equal(0, model.Hole);
        Assert.InRange(model.Mu, 300 - 450, 300 + 450);
        Assert.InRange(model.Sigma, 2700, 3300);
    }

    [Fact]
    public void Fit_FindsTheHole_OfAReelWithItsCentreBinnedOut()
    {
        // Referee: MathNet's N(0, 5000) with |x| < 4000 removed. The smallest |x| of 200 parts is above the true edge
        // by about one spacing there (1 / (n × density at the edge) ≈ 33 ppm); the posterior mean sits below it.
        var x = Draw(new Normal(0, 5000, new Random(11)), 200, gap: 4000);

        var model = ReelModel.Fit(x, Lo, Hi, s_weakPrior);

        var smallest = x.Min(Math.Abs);
        Assert.InRange(model.Hole, 3800, smallest);
        Assert.InRange(model.Sigma, 4000, 6500);
        Assert.Equal(0, model.Cdf(3500) - model.Cdf(-3500), 2);
    }

    [Fact]
    public void HoleTest_KeepsAFalseHole_InAboutAThousandthOfNormalReels()
    {
        // Under no hole, n·P(|X| < smallest |x|) ≈ Exp(1), so a gain over ln 1000 happens about 0.1 % of the time
        // (order statistics of uniforms, textbook). 400 small samples of N(0, 3333): allow up to 1 % (4; the binomial
        // count at 0.1 % is 0.4 ± 0.6), far below the ~50 % an information criterion (BIC) would give at n = 4.
        var rng = new Random(3);
        var kept = 0;
        for (var t = 0; t < 400; t++)
        {
            var x = Draw(new Normal(0, 3333, rng), 4 + (t % 17), gap: 0);
            kept += ReelModel.Fit(x, Lo, Hi, s_weakPrior).Hole > 0 ? 1 : 0;
        }

        Assert.InRange(kept, 0, 4);
    }

    [Fact]
    public void Cdf_MatchesTheEmpiricalShareOfALargeSample()
    {
        // Referee: the empirical distribution of 20 000 MathNet draws of the fitted law itself (N(μ, σ) restricted to
        // the support), which must agree with the model's Cdf to a Kolmogorov–Smirnov margin (1.36/√n ≈ 0.01 at 5 %).
        var x = Draw(new Normal(0, 5000, new Random(5)), 300, gap: 4000);
        var model = ReelModel.Fit(x, Lo, Hi, s_weakPrior);
        var big = Draw(new Normal(model.Mu, model.Sigma, new Random(9)), 20_000, gap: model.Hole).Order().ToArray();

        var worst = 0.0;
        foreach (var y in new[] { -9000.0, -6000, -4500, -4100, 4100, 4500, 6000, 9000 })
        {
            var share = (double)big.Count(v => v <= y) / big.Length;
            worst = Math.Max(worst, Math.Abs(share - model.Cdf(y)));
        }

        Assert.True(worst < 0.015, $"largest difference {worst}");
        Assert.Equal(0, model.Cdf(Lo), 9);
        Assert.Equal(1, model.Cdf(Hi), 9);
    }

    private static List<double> Draw(Normal normal, int n, double gap)
    {
        var x = new List<double>(n);
        while (x.Count < n)
        {
            var v = normal.Sample();
            if (Math.Abs(v) >= gap && v is >= Lo and <= Hi)
            {
                x.Add(v);
            }
        }

        return x;
    }
}
