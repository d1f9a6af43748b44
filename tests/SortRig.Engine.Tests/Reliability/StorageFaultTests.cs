using SortRig.Engine.Sorting;
using SortRig.Engine.Tests.Reliability.Support;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Engine.Tests.Reliability;

/// <summary>
/// Storage faults while a session runs: the database locked by another process, made read-only,
/// or on a full disk. Each must give the operator a clear message, pause the session (no part
/// accepted while it lasts), leave nothing half-written, and carry on once the fault is cleared.
/// </summary>
[Collection(ReliabilityCollection.Name)]
[Trait(ReliabilityCollection.Clock, ReliabilityCollection.Wall)]
public sealed class StorageFaultTests(ITestOutputHelper output) : IDisposable
{
    private const int Parts = 8;
    private static readonly TimeSpan s_limit = TimeSpan.FromSeconds(90);
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-storage-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [RootFact("python3")]
    public async Task LockedByAnotherProcess_BetweenAnnouncementAndItsMark_PausesThenCarriesOn()
    {
        var db = Path.Combine(_dir, "locked.db");
        await using var fault = new HeldLock(db);

        // Injected inside the announcement of part 3, so the first write to fail is its "announced" mark.
        await RunWithFaultAsync(db, fault, injectInsideAnnouncement: true, "locked by another program");
    }

    [RootFact("chattr")]
    public async Task MadeReadOnly_PausesThenCarriesOn()
    {
        var db = Path.Combine(_dir, "readonly.db");
        await using var fault = new ReadOnlyFile(db);
        await RunWithFaultAsync(db, fault, injectInsideAnnouncement: false, "storage fault");
    }

    [RootFact("mount")]
    public async Task DiskFull_PausesThenCarriesOn()
    {
        var (mount, why) = await Tmpfs.MountAsync("3m");
        Assert.True(mount is not null, $"cannot mount a tmpfs: {why}");
        await using (mount)
        {
            var db = Path.Combine(mount.Path, "full.db");
            await using var fault = new FullDisk(mount.Path);
            await RunWithFaultAsync(db, fault, injectInsideAnnouncement: false, "the disk is full");
        }
    }

    private async Task RunWithFaultAsync(
        string db,
        IStorageFault fault,
        bool injectInsideAnnouncement,
        string expectedWords
    )
    {
        var options = new SortOptions
        {
            // 10 NPLC: a reading takes 401 ms, 8 ms of wall time at speed 50 (ScaledTimeProvider timers
            // shorter than 1 ms of wall time fire at once, which would squeeze the readings together).
            Database = db,
            Session = "storage",
            Parts = Parts,
            Seed = 909,
            Speed = 50,
            Nplc = 10,
            Speech = false,
            Live = false,
        };
        var sort = new InProcessSort(options);
        using var cts = new CancellationTokenSource(s_limit);
        var third = sort.Ears.HeardAsync(l => l.StartsWith("part 3: cup", StringComparison.Ordinal), s_limit);
        var told = sort.Ears.HeardAsync(l => l.StartsWith("note: storage fault", StringComparison.Ordinal), s_limit);
        if (injectInsideAnnouncement)
        {
            sort.Ears.OnLine = line =>
            {
                if (line.StartsWith("part 3: cup", StringComparison.Ordinal))
                {
                    fault.InjectAsync().GetAwaiter().GetResult();
                }
            };
        }

        // The operator was told the part stays in the fixture until it is saved: a patient person.
        var run = sort.RunAsync(
            b => b with { Operator = b.Operator with { MaxDwell = TimeSpan.FromHours(1) } },
            cts.Token
        );
        await third;
        if (!injectInsideAnnouncement)
        {
            await fault.InjectAsync();
        }

        await told;
        var note = sort.Ears.Text.Split('\n').First(l => l.StartsWith("note: storage fault", StringComparison.Ordinal));
        Assert.Contains(expectedWords, note, StringComparison.Ordinal);
        Assert.Contains(db, note, StringComparison.Ordinal); // names the file

        // Paused: while the fault lasts (1 s of wall time, 50 s on the bench clock) no part is accepted,
        // and what is stored is whole.
        Assert.True(sort.Services.Snapshot.Session?.Paused);
        var storedBefore = CountParts(db);
        var heardBefore = Announcements.Cups(sort.Ears.Text).Count;
        await Task.Delay(TimeSpan.FromSeconds(1));
        Assert.Equal(storedBefore, CountParts(db));
        Assert.Equal(heardBefore, Announcements.Cups(sort.Ears.Text).Count);
        AssertWhole(db);

        await fault.ClearAsync();
        var outcome = await run;
        output.WriteLine(sort.Ears.Text);

        Assert.Equal(Parts, outcome.PartsRecorded);
        Assert.True(outcome.StorageFaults > 0);
        Assert.Contains("storage is back", sort.Ears.Text, StringComparison.Ordinal);
        AssertWhole(db);
        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        var parts = await log.GetPartsAsync(outcome.SessionId, default);
        Assert.Equal(Enumerable.Range(1, Parts), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));
        Assert.Equal(
            parts.Select(p => $"{p.Number}:{p.CupLabel}"),
            Announcements.Cups(sort.Ears.Text).Select(h => $"{h.Part}:{h.Cup}")
        );
        var bench = await sort.Bench;
        var (problems, _) = TruthCheck.Compare(options, parts, n => bench.Truth(n - 1));
        Assert.Empty(problems);
    }

    private static long CountParts(string db)
    {
        using var c = DatabaseChecks.Open(db);
        using var q = c.CreateCommand();
        q.CommandText = "SELECT COUNT(*) FROM parts";
        return (long)q.ExecuteScalar()!;
    }

    // integrity_check passes, and no part is stored without the readings it was accepted from.
    private static void AssertWhole(string db)
    {
        DatabaseChecks.AssertIntegrity(db);
        using var c = DatabaseChecks.Open(db);
        using var bare = c.CreateCommand();
        bare.CommandText =
            "SELECT COUNT(*) FROM parts p WHERE (SELECT COUNT(*) FROM raw_readings r WHERE r.part_id = p.id) < 8";
        Assert.Equal(0L, (long)bare.ExecuteScalar()!);
    }
}
