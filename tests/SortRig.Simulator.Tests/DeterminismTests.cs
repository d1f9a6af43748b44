using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests;

public sealed class DeterminismTests
{
    [Fact]
    public async Task SameSeed_SameReelAndSameReadingSequence_OtherSeedDiffers()
    {
        var a = await RecordAsync(seed: 21);
        var b = await RecordAsync(seed: 21);
        var c = await RecordAsync(seed: 22);

        Assert.Equal(a.Reel, b.Reel);
        Assert.Equal(a.Readings, b.Readings);
        Assert.NotEqual(a.Reel, c.Reel);
        Assert.NotEqual(a.Readings, c.Readings);
    }

    private static async Task<(double[] Reel, string Readings)> RecordAsync(int seed)
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Benches.Manual(seed: seed), clock);
        bench.Fixture.Insert(bench.Reel[0], warmKelvin: 3);
        await bench.ExecuteAsync("CONF:RES 10000;:RES:NPLC 0.2;:SAMP:COUN 50");
        var readings = await VirtualTime.RunAsync(clock, bench.ExecuteAsync("READ?"), TimeSpan.FromMilliseconds(9));
        return (bench.Reel.Select(p => p.OhmsAt23C).ToArray(), readings!);
    }
}
