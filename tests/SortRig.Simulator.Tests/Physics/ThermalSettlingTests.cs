using MathNet.Numerics;
using SortRig.Simulator.Physics;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Physics;

public sealed class ThermalSettlingTests
{
    [Fact]
    public async Task WarmPart_ReadingsDecayToTruthWithTheConfiguredTimeConstant()
    {
        var clock = Benches.FakeClock();
        var reel = Benches.SingleNominal(10_000, tempco: 100) with { ThermalTimeConstant = TimeSpan.FromSeconds(4) };
        await using var bench = new SimulatedBench(Benches.Manual(reel), clock);
        await bench.ExecuteAsync("CONF:RES 10000;:RES:NPLC 10");
        var reading = TimeSpan.FromSeconds((10.0 / 50 * 2) + 0.001); // NPLC/f x 2 (autozero) + 1 ms
        var truth = bench.Truth(0);

        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 5);
        var inserted = clock.GetUtcNow();
        var times = new List<double>();
        var excess = new List<double>();
        for (var k = 0; k < 100; k++)
        {
            var read = bench.ExecuteAsync("READ?");
            clock.Advance(reading);
            var value = Numbers.Parse((await read.WaitAsync(TimeSpan.FromSeconds(5)))!);
            times.Add((clock.GetUtcNow() - inserted).TotalSeconds);
            excess.Add((value / truth) - 1);
        }

        // Newton cooling (common practice, no source): excess = alpha dT0 exp(-t / tau). Fit ln(excess) to a line
        // where the excess is well above the 0.2 ppm noise, past the 30 ms contact bounce.
        var usable = times.Zip(excess).Where(p => p.First > 0.1 && p.Second > 20e-6).ToArray();
        var (intercept, slope) = Fit.Line(
            usable.Select(p => p.First).ToArray(),
            usable.Select(p => Math.Log(p.Second)).ToArray()
        );
        Assert.Equal(4.0, -1 / slope, 0.1);
        Assert.Equal(100e-6 * 5, Math.Exp(intercept), 0.02 * 500e-6);
        Assert.InRange(Math.Abs(excess[^1]), 0, 2e-6); // 40 s = 10 tau later: settled to truth
    }

    [Fact]
    public void WarmPart_TemperatureAtOneTimeConstant_IsAmbientPlusExcessOverE()
    {
        var celsius = PartThermal.Celsius(23, 5, TimeSpan.FromSeconds(4), TimeSpan.FromSeconds(4));

        Assert.Equal(23 + (5 / Math.E), celsius, 12);
    }
}
