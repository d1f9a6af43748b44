using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Host.Tests.Lab.Support;
using SortRig.Simulator;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Lab;

/// <summary>
/// The lab server going away in the middle of a sort and of a drift run: restarted (a real server of the test's own,
/// shut down and started again) or a stalled link (a proxy that stops forwarding). Outside references: the
/// simulator's truth (every part in the cup its true value calls for, JCGM 100:2008 sec. 6 expanded uncertainty, as
/// in the reliability tests), the numbering rule 1..n once each (docs/storage.md), and the drift run's own count of
/// scans (every sample read is stored; every hole in the time series longer than 1.5 intervals is a recorded gap).
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class LabOutageTests(ITestOutputHelper output)
{
    private const int Parts = 8;
    private static readonly TimeSpan s_limit = TimeSpan.FromMinutes(3);

    [LabFact]
    public async Task ServerRestart_MidSort_PausesTellsAndCarriesOn() =>
        await SortThroughAsync(await ServerRestart.CreateAsync(), TimeSpan.FromSeconds(1));

    [LabFact]
    public async Task StalledLink_MidSort_PausesTellsAndCarriesOn() =>
        await SortThroughAsync(await StalledLink.CreateAsync(), TimeSpan.FromSeconds(5));

    [LabFact]
    public async Task ServerRestart_MidDrift_BufferedSamplesWrittenAndTheRestAGap() =>
        await DriftThroughAsync(await ServerRestart.CreateAsync());

    [LabFact]
    public async Task StalledLink_MidDrift_BufferedSamplesWrittenAndTheRestAGap() =>
        await DriftThroughAsync(await StalledLink.CreateAsync());

    private async Task SortThroughAsync(IOutage outage, TimeSpan hold)
    {
        await using var _ = outage;
        var options = new SortOptions
        {
            Database = outage.Database,
            Session = "lab-outage",
            Parts = Parts,
            Seed = 919,
            Speed = 50,
            Nplc = 10,
            Speech = false,
            Live = false,
        };
        var sort = new InProcessSort(options);
        using var cts = new CancellationTokenSource(s_limit);
        var third = sort.Ears.HeardAsync(l => l.StartsWith("part 3: cup", StringComparison.Ordinal), s_limit);
        var told = sort.Ears.HeardAsync(l => l.StartsWith("note: storage fault", StringComparison.Ordinal), s_limit);
        var run = sort.RunAsync(
            b => b with { Operator = b.Operator with { MaxDwell = TimeSpan.FromHours(1) } },
            cts.Token
        );
        await third;
        await outage.BeginAsync();
        await told;

        // Paused while it lasts: nothing accepted, nothing announced.
        var note = sort.Ears.Text.Split('\n').First(l => l.StartsWith("note: storage fault", StringComparison.Ordinal));
        Assert.Contains("the database cannot be reached", note, StringComparison.Ordinal);
        Assert.Contains("paused, nothing lost", note, StringComparison.Ordinal);
        Assert.True(sort.Services.Snapshot.Session?.Paused);
        var heard = Announcements.Cups(sort.Ears.Text).Count;
        await Task.Delay(hold);
        Assert.Equal(heard, Announcements.Cups(sort.Ears.Text).Count);

        await outage.EndAsync();
        var outcome = await run;
        output.WriteLine(sort.Ears.Text);

        Assert.True(outcome.StorageFaults > 0);
        Assert.Contains("storage is back", sort.Ears.Text, StringComparison.Ordinal);
        await using var log = await outage.Lab.OpenAsync();
        var parts = await log.GetPartsAsync(outcome.SessionId, CancellationToken.None);
        int lost = Parts - parts.Select(p => p.Number).Distinct().Count(),
            doubled = parts.Count - parts.Select(p => p.Number).Distinct().Count();
        output.WriteLine($"parts lost {lost}, doubled {doubled}, storage faults {outcome.StorageFaults}");
        Assert.Equal(Enumerable.Range(1, Parts), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));
        Assert.Equal(
            parts.Select(p => $"{p.Number}:{p.CupLabel}"),
            Announcements.Cups(sort.Ears.Text).Select(h => $"{h.Part}:{h.Cup}")
        );
        var bench = await sort.Bench;
        var (problems, _) = TruthCheck.Compare(options, parts, n => bench.Truth(n - 1));
        Assert.Empty(problems);
        Assert.True((await log.VerifyAsync(CancellationToken.None)).IsOk);
    }

    private async Task DriftThroughAsync(IOutage outage)
    {
        await using var _ = outage;

        // 10 s interval at 40x: a scan every 0.25 s of wall time; batches of 4 samples, so the buffer (4 batches)
        // holds 4 scans. The outage lasts 4 s of wall time: about 16 intervals, more than the buffer holds.
        var settings = new DriftOptions
        {
            Database = outage.Database,
            Run = "lab-drift-outage",
            Channels = "101-102",
            IntervalSeconds = 10,
            Hours = 0.2,
            Seed = 77,
            Speed = 40,
            BatchSize = 4,
        }.Validate();
        var time = new ScaledTimeProvider(settings.Speed);
        var hub = new BenchEventHub(time);
        var run = DriftRunner.RunAsync(
            settings,
            new DriftServices(time, TimeProvider.System, hub, NullLoggerFactory.Instance),
            null,
            CancellationToken.None
        );
        await Task.Delay(TimeSpan.FromSeconds(3));
        var down = time.GetUtcNow();
        await outage.BeginAsync();
        await Task.Delay(TimeSpan.FromSeconds(4));
        await outage.EndAsync();
        var up = time.GetUtcNow();
        var outcome = await run.WaitAsync(s_limit);

        await using var log = await outage.Lab.OpenAsync();
        var samples = new List<StoredDriftSample>();
        await foreach (var s in log.ReadDriftSamplesAsync(outcome.RunId, CancellationToken.None))
        {
            samples.Add(s);
        }

        var gaps = await log.GetDriftGapsAsync(outcome.RunId, CancellationToken.None);
        var times = samples.Select(s => s.Time).Distinct().Order().ToList();
        // Holes in the time series while the store was away (a loaded machine also skips scans now and then: counted
        // as skipped scan times, not under test here).
        var holes = times
            .Zip(times.Skip(1))
            .Where(p => p.Second - p.First > settings.Interval * 1.5 && p.First < up && p.Second > down)
            .ToList();
        var unexplainedHoles = holes.Where(h => !gaps.Any(g => g.From <= h.First && g.To >= h.Second)).ToList();

        // A hole no gap covers must be scans the logger counted as skipped (a loaded machine late for its tick),
        // never samples that went missing without a word.
        var unexplainedScans = unexplainedHoles.Sum(h =>
            (long)Math.Round((h.Second - h.First) / settings.Interval) - 1
        );
        var unexplained = unexplainedScans > outcome.SkippedTicks ? unexplainedHoles.Count : 0;
        long lost = (outcome.Scans * 4) - samples.Count;
        output.WriteLine(
            $"scans {outcome.Scans}, samples stored {samples.Count}, lost {lost}, gaps {gaps.Count} ("
                + $"{string.Join("; ", gaps.Select(g => $"{g.From:HH:mm:ss}..{g.To:HH:mm:ss} {g.Reason}"))}), holes "
                + $"{string.Join("; ", holes.Select(h => $"{h.First:HH:mm:ss.fff}..{h.Second:HH:mm:ss.fff}"))}, "
                + $"unexplained {unexplained} (holes without a gap {unexplainedHoles.Count}, "
                + $"{unexplainedScans} scans; skipped ticks {outcome.SkippedTicks})"
        );

        Assert.Equal(0, lost); // every sample read was stored, those buffered during the outage too
        Assert.Equal(samples.Count, outcome.SamplesStored);
        Assert.Contains(gaps, g => g.Reason.Contains("storage unreachable", StringComparison.Ordinal));
        Assert.NotEmpty(holes); // the outage did cost scans ...
        Assert.Equal(0, unexplained); // ... and every one of those holes is a recorded gap
        Assert.True(outcome.Scans > 20, $"only {outcome.Scans} scans");
    }
}
