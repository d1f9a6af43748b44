using MathNet.Numerics.Statistics;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Tests.Physics;

public sealed class ReelBuilderTests
{
    [Fact]
    public void Build_BimodalCulledCentre_HasNoPartInTheCentreAndBothHalvesPopulated()
    {
        // Parts culled from the middle of the band (sold as a tighter grade): common practice, no source.
        var spec = new ReelSpec
        {
            Count = 2000,
            Nominals = [new(10_000, 1)],
            TolerancePercent = 1,
            Distribution = ValueDistribution.Bimodal(0.5, 0.4),
        };

        var parts = ReelBuilder.Build(spec, seed: 11);

        var deviationsInTolerance = parts.Select(p => p.Deviation / 0.01).ToArray();
        Assert.All(deviationsInTolerance, d => Assert.InRange(Math.Abs(d), 0.4, 1.0));
        Assert.InRange(deviationsInTolerance.Count(d => d < 0), 800, 1200);
    }

    [Fact]
    public void Build_Truncated_KeepsEveryPartInTolerance()
    {
        var spec = new ReelSpec
        {
            Count = 2000,
            Nominals = [new(1_000, 1)],
            TolerancePercent = 0.5,
            Distribution = ValueDistribution.Truncated(0.8),
        };

        var parts = ReelBuilder.Build(spec, seed: 3);

        Assert.All(parts, p => Assert.InRange(Math.Abs(p.Deviation), 0, 0.005));
    }

    [Fact]
    public void Build_Normal_SampleSigmaMatchesSpecWithinSamplingError()
    {
        var spec = new ReelSpec
        {
            Count = 4000,
            Nominals = [new(10_000, 1)],
            TolerancePercent = 1,
            Distribution = ValueDistribution.Normal(0.3),
        };

        var deviations = ReelBuilder.Build(spec, seed: 5).Select(p => p.Deviation).ToArray();

        // sigma 0.3 x 1 % = 0.3 %; standard error of s for n = 4000 is about s / sqrt(2n) = 1.1 %.
        Assert.InRange(deviations.StandardDeviation(), 0.003 * 0.95, 0.003 * 1.05);
        Assert.InRange(deviations.Mean(), -0.00015, 0.00015); // 3.2 standard errors (0.003 / sqrt(4000))
    }

    [Fact]
    public void Build_Uniform_SpansTheBandEvenly()
    {
        var spec = new ReelSpec
        {
            Count = 4000,
            Nominals = [new(100, 1)],
            TolerancePercent = 2,
            Distribution = ValueDistribution.Uniform(),
        };

        var deviations = ReelBuilder.Build(spec, seed: 9).Select(p => p.Deviation / 0.02).ToArray();

        Assert.All(deviations, d => Assert.InRange(d, -1.0, 1.0));
        // Uniform on [-1, 1] has sigma 1/sqrt(3) = 0.577 (textbook).
        Assert.InRange(deviations.StandardDeviation(), 0.55, 0.60);
    }

    [Fact]
    public void Build_MixedNominals_FollowTheirShares()
    {
        var spec = new ReelSpec { Count = 3000, Nominals = [new(10_000, 2), new(20_000, 1)] };

        var parts = ReelBuilder.Build(spec, seed: 1);

        Assert.InRange(parts.Count(p => p.NominalOhms == 20_000), 900, 1100);
    }

    [Fact]
    public void Build_SameSeed_GivesTheSameReel_OtherSeedDiffers()
    {
        var spec = new ReelSpec { Count = 50, DriftSigmaPpmPerHour = 1 };

        var a = ReelBuilder.Build(spec, seed: 42);
        var b = ReelBuilder.Build(spec, seed: 42);
        var c = ReelBuilder.Build(spec, seed: 43);

        Assert.Equal(a, b);
        Assert.NotEqual(a.Select(p => p.OhmsAt23C), c.Select(p => p.OhmsAt23C));
    }

    [Fact]
    public void OhmsAt_FollowsLinearTempcoAndDrift()
    {
        var part = new SimulatedPart(
            0,
            10_000,
            10_010,
            TempcoPpmPerKelvin: 50,
            DriftPpmPerHour: 2,
            TimeSpan.FromSeconds(4)
        );

        // R = R23 (1 + alpha (T - 23)) (1 + drift h): 10 010 x (1 + 50e-6 x 10) x (1 + 2e-6 x 12), by hand.
        Assert.Equal(10_010 * 1.0005 * 1.000024, part.OhmsAt(33, 12), 9);
    }
}
