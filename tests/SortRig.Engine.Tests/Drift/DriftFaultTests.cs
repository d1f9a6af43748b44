using SortRig.Engine.DriftLogging;
using SortRig.Simulator.Faults;
using SortRig.Tests.Support;

namespace SortRig.Engine.Tests.Drift;

/// <summary>A meter that drops the connection and one that silently resets, mid-run (simulator fault
/// injector).</summary>
public sealed class DriftFaultTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-drift-fault-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task DropAndReset_MidRun_RunContinues_GapsMarked_NoSampleLostOrDuplicated()
    {
        var db = Path.Combine(_dir, "faults.db");
        var settings = new DriftOptions
        {
            Database = db,
            Channels = "101-104",
            IntervalSeconds = 10,
            Hours = 1,
            Seed = 5,
        }.Validate();
        var armed = new HashSet<FaultKind>();

        var (outcome, bench) = await DriftRuns.RunAsync(settings, (b, next) =>
        {
            if (next >= DriftRuns.Start.AddMinutes(20) && armed.Add(FaultKind.DropConnection))
            {
                b.Faults.Inject(FaultKind.DropConnection);
            }

            if (next >= DriftRuns.Start.AddMinutes(40) && armed.Add(FaultKind.SilentReset))
            {
                b.Faults.Inject(FaultKind.SilentReset);
            }
        });

        Assert.Equal(1, bench.Faults.Log.Count(FaultKind.DropConnection));
        Assert.Equal(1, bench.Faults.Log.Count(FaultKind.SilentReset));

        // The run went on: the faulted scans were retried after the back-off within their interval.
        Assert.Equal(360, outcome.Scans);
        Assert.Equal(0, outcome.SkippedTicks);
        var samples = await DriftRuns.SamplesAsync(db, outcome.RunId);
        Assert.Equal(360 * 6, samples.Count);
        Assert.Equal(samples.Count, outcome.SamplesStored);
        for (var channel = 0; channel <= 4; channel++)
        {
            var ofChannel = samples.Where(s => s.Channel == channel).Select(s => s.Time).ToList();
            Assert.Equal(channel == 4 ? 720 : 360, ofChannel.Count);
            Assert.Equal(ofChannel.Count, ofChannel.Distinct().Count());
        }

        // Two gaps, each from the last good sample before the fault to the first good one after it,
        // with no stored sample inside.
        var gaps = await DriftRuns.GapsAsync(db, outcome.RunId);
        Assert.Equal(2, gaps.Count);
        Assert.Equal(2, outcome.Gaps);
        Assert.Contains("connection lost", gaps[0].Reason, StringComparison.Ordinal);
        Assert.Contains("reset", gaps[1].Reason, StringComparison.Ordinal);
        var times = samples.Select(s => s.Time).ToHashSet();
        foreach (var gap in gaps)
        {
            Assert.Contains(gap.From, times);
            Assert.Contains(gap.To, times);
            Assert.InRange((gap.To - gap.From).TotalSeconds, 0.5, 20);
            Assert.DoesNotContain(samples, s => s.Time > gap.From && s.Time < gap.To);
        }

        Assert.InRange(gaps[0].From, DriftRuns.Start.AddMinutes(19.8), DriftRuns.Start.AddMinutes(20.2));
        Assert.InRange(gaps[1].From, DriftRuns.Start.AddMinutes(39.8), DriftRuns.Start.AddMinutes(40.2));
    }
}
