using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Meter;

/// <summary>
/// Per-range gain error: each range reads (1 + g_r) times the input, g_r seeded within ±the option.
/// The outside reference is the bench's truth side channel (SIM:PART:TRUE?, SIM:GAIN?) over a real socket.
/// </summary>
public sealed class RangeGainTests
{
    [Fact]
    public async Task Read_OnTwoRanges_EachOffFromTheTruthByItsOwnGain()
    {
        var options = Benches.Manual(Benches.SingleNominal(10_000, count: 2)) with { RangeGainErrorPpm = 50 };
        await using var bench = new SimulatedBench(options, new ScaledTimeProvider(200));
        await using var client = await ScpiTestClient.ConnectAsync(await bench.StartTcpAsync());
        await client.SendAsync("SIM:FIXT:INS 0,0"); // no handling warmth: the truth holds from the first reading
        var truth = await client.QueryNumberAsync("SIM:PART:TRUE? 0");

        var errors = new Dictionary<double, double>();
        foreach (var range in new[] { 1e4, 1e5 })
        {
            await client.SendAsync($"CONF:FRES {range};:FRES:NPLC 10");
            var sum = 0.0;
            const int n = 20;
            for (var i = 0; i < n; i++)
            {
                sum += await client.QueryNumberAsync("READ?");
            }

            errors[range] = ((sum / n / truth) - 1) * 1e6;
            var gain = await client.QueryNumberAsync($"SIM:GAIN? {range}");
            Assert.Equal(bench.GainErrorPpm(range), gain, 6);

            // 10 NPLC: noise 0.25 ppm of range and a 0.2 ppm of range step (docs/simulator.md); on the 100 kOhm
            // range that is sqrt(2.5² + 2²/12) = 2.56 ppm of this 10 kOhm part per reading, 0.57 ppm for the mean of
            // 20: 2 ppm is 3.5 sigma.
            Assert.InRange(errors[range] - gain, -2, 2);
        }

        // The two ranges disagree by the difference of their gains: what a bridging part reveals.
        Assert.NotEqual(bench.GainErrorPpm(1e4), bench.GainErrorPpm(1e5));
    }

    [Fact]
    public void Gains_AreSeededPerRangeAndWithinTheHalfWidth()
    {
        var ranges = new[] { 100, 1e3, 1e4, 1e5, 1e6, 1e7 };
        var a = new SimulatedBench(Benches.Manual(seed: 11) with { RangeGainErrorPpm = 30 });
        var again = new SimulatedBench(Benches.Manual(seed: 11) with { RangeGainErrorPpm = 30 });
        var other = new SimulatedBench(Benches.Manual(seed: 12) with { RangeGainErrorPpm = 30 });
        var ideal = new SimulatedBench(Benches.Manual(seed: 11));

        Assert.All(ranges, r => Assert.InRange(a.GainErrorPpm(r), -30, 30));
        Assert.Equal(ranges.Select(a.GainErrorPpm), ranges.Select(again.GainErrorPpm));
        Assert.NotEqual(ranges.Select(a.GainErrorPpm), ranges.Select(other.GainErrorPpm));
        Assert.Equal(ranges.Length, ranges.Select(a.GainErrorPpm).Distinct().Count());
        Assert.All(ranges, r => Assert.Equal(0, ideal.GainErrorPpm(r)));
        Assert.Equal(a.Reel, ideal.Reel); // the gain stream leaves the reel alone
    }

    [Fact]
    public void Options_GainHalfWidthOutOfRange_NamesTheOption()
    {
        var e = Assert.ThrowsAny<ArgumentException>(() =>
            new SimulatedBench(Benches.Manual() with { RangeGainErrorPpm = 2000 })
        );
        Assert.Contains("RangeGainErrorPpm", e.Message, StringComparison.Ordinal);
    }
}
