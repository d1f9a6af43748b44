using SortRig.Simulator.Operator;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests;

/// <summary>A whole reel through a real socket on a clock 200x real time, as a host would drive it.</summary>
public sealed class EndToEndTests
{
    [Fact]
    public async Task AutoOperator_WholeReelMeasuredOverTcp_EveryPartCloseToTruth()
    {
        var options = Benches.Manual(Benches.SingleNominal(10_000, count: 6, tempco: 50)) with
        {
            // A long dwell: the operator waits for the announcement however slow the test machine is.
            Operator = new OperatorOptions { Mode = OperatorMode.Auto, MaxDwell = TimeSpan.FromHours(1) },
        };
        await using var bench = new SimulatedBench(options, new ScaledTimeProvider(200));
        await using var client = await ScpiTestClient.ConnectAsync(await bench.StartTcpAsync());
        await client.SendAsync("CONF:RES 10000;:RES:NPLC 10");
        var measured = new Dictionary<int, double>();
        using var guard = new CancellationTokenSource(TimeSpan.FromSeconds(60));

        while (bench.Operator.State != OperatorState.Finished)
        {
            guard.Token.ThrowIfCancellationRequested();
            var index = (int)await client.QueryNumberAsync("SIM:PART:IND?");
            if (index < 0 || measured.ContainsKey(index))
            {
                await Task.Delay(2);
                continue;
            }

            measured[index] = await SettledReadingAsync(client);
            Assert.Equal(index, (int)await client.QueryNumberAsync("SIM:PART:IND?")); // still the same part
            await client.SendAsync("SIM:OPER:ANN");
        }

        Assert.Equal(Enumerable.Range(0, 6), measured.Keys.Order());
        Assert.All(measured, m => Assert.Equal(bench.Truth(m.Key), m.Value, 10_000 * 30e-6));
        Assert.Equal(0, bench.Operator.DwellTimeouts);
        Assert.Equal("+9.90000000E+37", await client.QueryAsync("READ?"));
    }

    /// <summary>A simple settle rule (common practice, no source): two finite readings within 1 ppm.</summary>
    private static async Task<double> SettledReadingAsync(ScpiTestClient client)
    {
        var previous = double.NaN;
        for (var i = 0; i < 200; i++)
        {
            var value = await client.QueryNumberAsync("READ?");
            if (value < 1e30 && Math.Abs(value - previous) <= value * 1e-6)
            {
                return value;
            }

            previous = value;
        }

        throw new TimeoutException("no settled reading");
    }
}
