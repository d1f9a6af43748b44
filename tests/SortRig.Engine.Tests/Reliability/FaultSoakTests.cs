using SortRig.Engine.Tests.Reliability.Support;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Engine.Tests.Reliability;

/// <summary>
/// Fault soak: a reel sorted by the real loop while the simulated meter drops connections, delays
/// replies past the timeout, garbles replies, queues spurious errors and resets itself to defaults,
/// at random. The simulator's truth is the outside reference for every part's value and cup.
/// </summary>
[Collection(ReliabilityCollection.Name)]
[Trait(ReliabilityCollection.Clock, ReliabilityCollection.Wall)]
public sealed class FaultSoakTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-soak-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Soak_Tcp_EveryPartLoggedOnceInItsTrueCup()
    {
        var settings = SoakSettings.FromEnvironment(parts: 500, faultRate: 0.09, speed: 200, seed: 7001);
        var options = FaultSoak.Options(_dir, settings);

        var r = await FaultSoak.RunAsync(options, settings, serve: null, Limit);

        output.WriteLine(FaultSoak.Figures("tcp", r, 0));
        SoakSettings.Report(FaultSoak.Figures("tcp", r, 0));
        SoakChecks.AssertSurvived(r, output);
        SoakChecks.AssertSuiteFloor(settings, r);
    }

    [SocatFact]
    public async Task Soak_SerialWithCablePulled_EveryPartLoggedOnceInItsTrueCup()
    {
        var settings = SoakSettings.FromEnvironment(parts: 500, faultRate: 0.085, speed: 200, seed: 7002);
        var options = FaultSoak.Options(_dir, settings);
        await using var cable = await SerialCable.StartAsync();
        using var stopPulling = new CancellationTokenSource();
        var rng = new Random(settings.Seed);

        // Every couple of seconds of wall time the cable is pulled for 20-150 ms and plugged back.
        async Task PullNowAndThenAsync()
        {
            try
            {
                while (true)
                {
                    await Task.Delay(settings.LinkCutEvery * (0.5 + rng.NextDouble()), stopPulling.Token);
                    await cable.PullAsync();
                    await Task.Delay(TimeSpan.FromMilliseconds(rng.Next(20, 150)), stopPulling.Token);
                    await cable.PlugInAsync();
                }
            }
            catch (OperationCanceledException)
            {
                // Soak over.
            }
        }

        var puller = Task.Run(PullNowAndThenAsync);
        SoakResult r;
        try
        {
            r = await FaultSoak.RunAsync(
                options,
                settings,
                serve: async (bench, ct) =>
                {
                    await bench.StartSerialAsync(cable.MeterSide, ct);
                    return $"ASRL::{cable.HostSide}::INSTR";
                },
                Limit
            );
        }
        finally
        {
            await stopPulling.CancelAsync();
            await puller;
        }

        output.WriteLine(FaultSoak.Figures("serial", r, cable.Pulls));
        SoakSettings.Report(FaultSoak.Figures("serial", r, cable.Pulls));
        SoakChecks.AssertSurvived(r, output);
        SoakChecks.AssertSuiteFloor(settings, r);
        Assert.True(cable.Pulls > 0);
    }

    private static TimeSpan Limit =>
        TimeSpan.FromSeconds(
            double.TryParse(Environment.GetEnvironmentVariable("SORTRIG_SOAK_LIMIT_S"), out var l) ? l : 600
        );
}
