using System.Globalization;
using SortRig.Simulator.Physics;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Serving;

/// <summary>Readings as a client sees them: real TCP, bench clock 1000x real time.</summary>
public sealed class ReadingsOverTcpTests
{
    private static async Task<(SimulatedBench Bench, ScpiTestClient Client)> StartAsync(SimulatedBenchOptions options)
    {
        var bench = new SimulatedBench(options, new ScaledTimeProvider(1000));
        return (bench, await ScpiTestClient.ConnectAsync(await bench.StartTcpAsync()));
    }

    [Theory]
    // Over-range 1.25 × 10 kOhm = 12 500 Ohm; parts within 0.1 % of 12.4 k read, of 13 k overflow.
    [InlineData(12_400, false)]
    [InlineData(13_000, true)]
    public async Task FixedRange_ValueAboveOnePointTwoFiveTimesRange_ReadsOverflow(double nominal, bool overflow)
    {
        var (bench, client) = await StartAsync(Benches.Manual(Benches.SingleNominal(nominal, tolerancePercent: 0.1)));
        await using var _ = bench;
        await using var __ = client;
        bench.Fixture.Insert(bench.Reel[0]);
        await client.SendAsync("CONF:RES 10000");

        var value = await client.QueryNumberAsync("READ?");

        Assert.Equal(overflow, value == Numbers.Overflow);
    }

    [Fact]
    public async Task Autorange_PicksTheRangeThatHoldsThePart()
    {
        var (bench, client) = await StartAsync(Benches.Manual(Benches.SingleNominal(20_000)));
        await using var _ = bench;
        await using var __ = client;
        bench.Fixture.Insert(bench.Reel[0]);

        var value = await client.QueryNumberAsync("READ?");

        Assert.Equal(bench.Truth(0), value, 20_000 * 1e-5);
        Assert.Equal("+1.00000000E+05", await client.QueryAsync("RES:RANG?"));
    }

    // Our documented resolution table (docs/simulator.md): step in ppm of range per NPLC.
    [Theory]
    [InlineData(0.04, 40)]
    [InlineData(0.4, 4)]
    [InlineData(1, 1)]
    [InlineData(4, 0.5)]
    [InlineData(10, 0.2)]
    [InlineData(40, 0.1)]
    public async Task Readings_AreQuantisedToTheDocumentedStep(double nplc, double stepPpm)
    {
        var (bench, client) = await StartAsync(Benches.Manual(Benches.SingleNominal(10_000)));
        await using var _ = bench;
        await using var __ = client;
        bench.Fixture.Insert(bench.Reel[0]);
        await client.SendAsync(
            string.Create(CultureInfo.InvariantCulture, $"CONF:RES 10000;:RES:NPLC {nplc};:SAMP:COUN 200")
        );
        await Task.Delay(50); // past contact bounce (30 ms at 1000x is 30 us)

        var values = await client.QueryNumbersAsync("READ?");

        var step = stepPpm * 1e-6 * 10_000;
        Assert.Equal(200, values.Length);
        Assert.All(values, v => Assert.Equal(Math.Round(v / step), v / step, 1e-3));
        var gaps = values
            .Distinct()
            .Order()
            .Zip(values.Distinct().Order().Skip(1))
            .Select(p => p.Second - p.First)
            .ToArray();
        if (nplc >= 0.4)
        {
            Assert.Equal(step, gaps.Min(), step * 1e-3); // noise spreads readings over neighbouring codes
        }
    }

    [Fact]
    public async Task ScanList_ReadReturnsOneReadingPerChannelInOrder()
    {
        var options = Benches.Manual() with { Ambient = new AmbientSpec { MeanCelsius = 23 } };
        var (bench, client) = await StartAsync(options);
        await using var _ = bench;
        await using var __ = client;
        for (var i = 0; i < 5; i++)
        {
            bench.Scanner.Load(101 + i, bench.Reel[i]);
        }

        await client.SendAsync("CONF:RES 10000;:ROUT:SCAN (@101:105,107,117)");
        await Task.Delay(50);
        var values = await client.QueryNumbersAsync("READ?");

        Assert.Equal(7, values.Length);
        for (var i = 0; i < 5; i++)
        {
            Assert.Equal(bench.Truth(i), values[i], 10_000 * 5e-6);
        }

        Assert.Equal(Numbers.Overflow, values[5]); // empty channel 107
        Assert.Equal(108.96, values[6], 0.02); // Pt100 at 23 degC, IEC 60751 table (from memory)
    }

    [Fact]
    public async Task BusTrigger_InitWaitsForTrgThenFetchReturnsReadings()
    {
        var (bench, client) = await StartAsync(Benches.Manual());
        await using var _ = bench;
        await using var __ = client;
        bench.Fixture.Insert(bench.Reel[0]);
        await client.SendAsync("TRIG:SOUR BUS;:SAMP:COUN 3;:INIT");

        await client.SendAsync("FETC?");
        Assert.Equal("-214,\"Trigger deadlock\"", await client.QueryAsync("SYST:ERR?"));

        await client.SendAsync("*TRG");
        var values = await client.QueryNumbersAsync("FETC?");
        Assert.Equal(3, values.Length);
    }
}
