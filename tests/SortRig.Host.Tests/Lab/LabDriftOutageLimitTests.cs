using SortRig.Engine.DriftLogging;
using SortRig.Host.Tests.Lab.Support;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.Lab;

/// <summary>
/// An unattended drift run waits out an unreachable server, but not for ever: after DriftStore.MaxOutage (1 h of bench
/// time) it stops with the fault, and what it stored before is there. Virtual time; the server is really stopped.
/// The 1 h bound is our own choice (docs/lab.md), common practice, no source.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class LabDriftOutageLimitTests
{
    [LabFact]
    public async Task ServerGoneForGood_DriftWaitsOneHourOfBenchTime_ThenStopsWithTheFault()
    {
        var server = await OwnServer.StartAsync();
        await using var _ = server;
        await using var lab = await LabStore.CreateAsync(server.ConnectionString);
        var settings = new DriftOptions
        {
            Database = lab.Writer,
            Run = "lab-gone",
            Channels = "101-102",
            IntervalSeconds = 10,
            Hours = 3,
            Seed = 9,
        }.Validate();
        var stopAt = DriftRuns.Start.AddMinutes(20);
        DateTimeOffset? stopped = null,
            last = null;

        Exception? thrown;
        try
        {
            thrown = await Record.ExceptionAsync(() => DriftRuns.RunAsync(settings, (_, next) =>
                {
                    last = next;
                    if (stopped is null && next >= stopAt)
                    {
                        stopped = next;
                        server.StopAsync().GetAwaiter().GetResult(); // the clock waits while the server goes down
                    }
                }));
        }
        finally
        {
            // Back up before anything is asserted, so a failure reads as itself and not as the lab's clean-up failing.
            if (stopped is not null)
            {
                await server.StartAgainAsync();
            }
        }

        var error = Assert.IsType<StorageException>(thrown);
        Assert.Equal(StorageFault.Unavailable, error.Fault);
        Assert.NotNull(stopped);
        var waited = last!.Value - stopped!.Value;
        Assert.True(waited >= DriftStore.MaxOutage, $"gave up after {waited} of bench time");
        Assert.True(waited < DriftStore.MaxOutage + TimeSpan.FromMinutes(5), $"waited {waited} of bench time");

        // The samples of the first 20 minutes are stored (120 scans x 4 readings), less what was still queued.
        await using var log = await lab.OpenAsync();
        var stoppedRun = await log.GetDriftRunAsync(1, CancellationToken.None); // the first run in the fresh lab
        Assert.Equal("lab-gone", stoppedRun?.Name);
        long stored = 0;
        await foreach (var s in log.ReadDriftSamplesAsync(stoppedRun!.Id, CancellationToken.None))
        {
            Assert.True(s.Time <= stopped.Value, $"a sample at {s.Time} after the server stopped at {stopped}");
            stored++;
        }

        // In virtual time the scans can run ahead of the writer: what sits in the queue (4 batches of 64) and the batch
        // in flight when the server goes is lost when the run gives up (docs/lab.md says so); everything older is
        // there.
        Assert.InRange(stored, (120 * 4) - (5 * 64), 120 * 4);
    }
}
