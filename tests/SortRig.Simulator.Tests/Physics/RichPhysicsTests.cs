using MathNet.Numerics.Statistics;
using SortRig.Simulator.Physics;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Physics;

public sealed class RichPhysicsTests
{
    private static SimulatedBenchOptions Rich(ReelSpec reel, PhysicsSpec? physics = null) =>
        Benches.Manual(reel) with
        {
            Physics = (physics ?? new PhysicsSpec()) with { Model = PhysicsModel.Rich },
        };

    [Fact]
    public async Task Rich_SameSeed_SameReelValuesAsSimple_PlusLeadPaths()
    {
        var reel = Benches.SingleNominal(10_000, count: 50, tempco: 25);
        await using var simple = new SimulatedBench(Benches.Manual(reel), Benches.FakeClock());
        await using var rich = new SimulatedBench(Rich(reel), Benches.FakeClock());

        // The rich model draws from streams of its own: the reel's true values, tempcos and body time constants stay.
        Assert.Equal(simple.Reel.Select(p => p.OhmsAt23C), rich.Reel.Select(p => p.OhmsAt23C));
        Assert.Equal(simple.Reel.Select(p => p.ThermalTimeConstant), rich.Reel.Select(p => p.ThermalTimeConstant));
        Assert.All(simple.Reel, p => Assert.Equal(0, p.LeadShare));
        Assert.All(rich.Reel, p =>
        {
            Assert.InRange(p.LeadShare, 0.2, 0.5);
            Assert.InRange(p.LeadTimeConstant / p.ThermalTimeConstant, 0.15, 0.35);
        });
    }

    [Fact]
    public void TwoPaths_TemperatureIsSumOfTwoNewtonDecays()
    {
        var part = new SimulatedPart(0, 1000, 1000, 50, 0, TimeSpan.FromSeconds(4))
        {
            LeadShare = 0.3,
            LeadTimeConstant = TimeSpan.FromSeconds(1),
        };

        // Two independent first-order paths (common practice, no source): dT(t) = dT0 ((1-w) e^(-t/tau) + w
        // e^(-t/tauL)).
        Assert.Equal(28.0, PartThermal.Celsius(part, 23, 5, TimeSpan.Zero), 12);
        var at4 = PartThermal.Celsius(part, 23, 5, TimeSpan.FromSeconds(4));
        Assert.Equal(23 + (5 * ((0.7 / Math.E) + (0.3 * Math.Exp(-4)))), at4, 12);
    }

    [Fact]
    public void SelfHeating_SettledValue_FollowsJoulesLaw()
    {
        // 100 Ohm part, 100 ppm/K, on the 100 Ohm range: I = 10 mA, P = I^2 R = 10 mW (Joule's law, textbook),
        // dT = P theta = 1 K at 100 K/W, dR/R = alpha dT = 100 ppm.
        var sample = new InputSample(false, 100, 100, 100);
        Assert.Equal(100 * (1 + 100e-6), SelfHeating.Apply(sample, 100), 9);

        // 10 kOhm part on the 10 kOhm range: I = 100 uA, P = 0.1 mW, dT = 0.01 K: 1 ppm at 100 ppm/K.
        Assert.Equal(10_000 * (1 + 1e-6), SelfHeating.Apply(sample with { Ohms = 10_000 }, 10_000), 9);
    }

    [Fact]
    public async Task Rich_PresentedValue_ApproachesSelfHeatedSettledValue()
    {
        var reel = Benches.SingleNominal(100, count: 1, tempco: 0) with
        {
            TempcoSigmaPpmPerKelvin = 0,
            TempcoMeanPpmPerKelvin = 80,
        };
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Rich(reel, new PhysicsSpec { AmbientWanderKelvin = 0 }), clock);
        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 4);
        var at = clock.GetUtcNow();
        var part = bench.Reel[0];
        var truth = bench.Truth(0);

        // At contact: handling warmth only (self-heating has not begun); much later: truth plus the Joule rise.
        Assert.Equal(truth * (1 + (80e-6 * 4)), bench.Fixture.Presented(at, 100), 9);
        var late = bench.Fixture.Presented(at + TimeSpan.FromMinutes(10), 100);
        Assert.Equal(truth * (1 + (80e-6 * 0.01 * 0.01 * truth * 100)), late, 9);
        Assert.Equal(late, bench.Fixture.Settled(at, 100), 9);
        Assert.True(part.LeadShare > 0);
    }

    [Fact]
    public void ExcessNoise_Flicker_HasTheSpecifiedStationaryVariance()
    {
        // Ornstein-Uhlenbeck stationary variance sigma^2 per component (textbook identity); samples 1000 s apart are
        // independent (longest time constant 100 s), so the sample variance is chi-square with sd sqrt(2/n) ~ 2.2 %.
        var noise = new ExcessNoise(new PhysicsSpec { FlickerPpm = 0.3, PopcornShare = 0 }, 11);
        var t0 = Benches.Start;
        noise.Reset(t0);
        var values = Enumerable.Range(1, 4000).Select(k => noise.Ppm(t0 + TimeSpan.FromSeconds(1000 * k))).ToArray();

        Assert.Equal(0.09, values.Variance(), 0.09 * 0.1);
        Assert.Equal(0, values.Mean(), 0.3 * 4 / Math.Sqrt(4000));
    }

    [Fact]
    public void ExcessNoise_Flicker_IsCorrelatedOverSeconds()
    {
        // Unlike white noise, neighbours 0.1 s apart share the 1, 10 and 100 s components: lag-one correlation
        // is (e^-1 + e^-0.1 + e^-0.01 + e^-0.001) / 4 ~ 0.82 for equal variances (OU autocorrelation, textbook).
        var noise = new ExcessNoise(new PhysicsSpec { FlickerPpm = 1, PopcornShare = 0 }, 12);
        var t0 = Benches.Start;
        noise.Reset(t0);
        var values = Enumerable.Range(1, 200_000).Select(k => noise.Ppm(t0 + TimeSpan.FromSeconds(0.1 * k))).ToArray();
        var r1 = Correlation.Pearson(values[..^1], values[1..]);

        Assert.InRange(r1, 0.7, 0.9);
    }

    [Fact]
    public void ExcessNoise_Popcorn_StepsBetweenTwoLevelsAtTheMeanRate()
    {
        var spec = new PhysicsSpec
        {
            FlickerPpm = 0,
            PopcornShare = 1,
            PopcornPpm = 4,
            PopcornDwell = TimeSpan.FromSeconds(6),
        };
        var noise = new ExcessNoise(spec, 13);
        var t0 = Benches.Start;
        noise.Reset(t0);
        var values = Enumerable.Range(1, 60_000).Select(k => noise.Ppm(t0 + TimeSpan.FromSeconds(0.1 * k))).ToArray();
        var flips = values.Zip(values.Skip(1)).Count(p => p.First != p.Second);

        Assert.All(values, v => Assert.True(v is 2 or -2));
        // Poisson count over 6000 s at one per 6 s: mean 1000, sd ~32 (exponential dwell; textbook).
        Assert.InRange(flips, 1000 - 130, 1000 + 130);
    }

    [Fact]
    public void AmbientWander_HasTheSpecifiedRms()
    {
        // Mean of sin^2 over whole periods is 1/2 (Parseval, textbook): four terms of amplitude rms sqrt(2/4).
        var wander = new AmbientWander(0.1, 21);
        var values = Enumerable.Range(0, 200_000).Select(k => wander.KelvinAt(TimeSpan.FromSeconds(7.3 * k))).ToArray();

        Assert.Equal(0.1, values.RootMeanSquare(), 0.01);
        Assert.Equal(0, AmbientWander.None.KelvinAt(TimeSpan.FromHours(3)));
    }

    [Fact]
    public void PhysicsSpec_InvalidFigure_NamesIt()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new PhysicsSpec { LeadShareMax = 0.1 }.Validate());
        Assert.Contains("PhysicsSpec.LeadShareMax", e.Message, StringComparison.Ordinal);
    }
}
