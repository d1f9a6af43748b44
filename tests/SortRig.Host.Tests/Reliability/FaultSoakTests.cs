using SortRig.Host.Tests.Reliability.Support;
using SortRig.Storage.Contracts;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Reliability;

/// <summary>
/// Fault soak: a reel sorted by the real loop while the simulated meter drops connections, delays
/// replies past the timeout, garbles replies, queues spurious errors and resets itself to defaults,
/// at random. The simulator's truth is the outside reference for every part's value and cup.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class FaultSoakTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-soak-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Soak_Tcp_EveryPartLoggedOnceInItsTrueCup()
    {
        var settings = SoakSettings.FromEnvironment(parts: 500, faultRate: 0.05, speed: 200, seed: 7001);
        var options = FaultSoak.Options(_dir, settings);

        var r = await FaultSoak.RunAsync(options, settings, serve: null, TimeSpan.FromSeconds(double.TryParse(Environment.GetEnvironmentVariable("SORTRIG_SOAK_LIMIT_S"), out var l) ? l : 600));

        output.WriteLine(FaultSoak.Figures("tcp", r, 0));
        SoakSettings.Report(FaultSoak.Figures("tcp", r, 0));
        SoakChecks.AssertSurvived(r, output);
    }
}
