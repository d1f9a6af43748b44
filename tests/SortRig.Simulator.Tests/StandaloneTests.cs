using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests;

public sealed class StandaloneTests
{
    [Fact]
    public async Task RunStandalone_ServesUntilCancelled()
    {
        using var stop = new CancellationTokenSource();
        var started = new TaskCompletionSource<SimulatedBench>();
        var run = SimulatedBench.RunStandaloneAsync(
            Benches.Manual() with
            {
                TcpPort = 0,
                TimeScale = 100,
            },
            null,
            b => started.SetResult(b),
            stop.Token
        );
        var bench = await started.Task.WaitAsync(ScpiTestClient.Guard);

        await using (var client = await ScpiTestClient.ConnectAsync(bench.TcpEndpoint!))
        {
            Assert.Equal(bench.Identity, await client.QueryAsync("*IDN?"));
        }

        await stop.CancelAsync();
        await run.WaitAsync(ScpiTestClient.Guard);
    }

    [Fact]
    public async Task RunStandalone_NeitherTcpNorSerial_Throws() =>
        await Assert.ThrowsAsync<ArgumentException>(() =>
            SimulatedBench.RunStandaloneAsync(new SimulatedBenchOptions { TcpPort = null }, CancellationToken.None)
        );
}
