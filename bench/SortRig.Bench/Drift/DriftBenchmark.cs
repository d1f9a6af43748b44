using System.Diagnostics;
using System.Globalization;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Engine.DriftLogging;
using SortRig.Engine.Events;
using SortRig.Engine.Simulation;

namespace SortRig.Bench.Drift;

/// <summary>
/// `drift` benchmark: a 12-hour drift log of 4 parts every 10 s on the embedded simulator (real TCP socket, real
/// SQLite file) in virtual time; managed memory sampled at whole hours. Writes docs/bench-drift.md.
/// </summary>
internal static class DriftBenchmark
{
    private static readonly DateTimeOffset s_start = new(2025, 11, 14, 18, 0, 0, TimeSpan.Zero);

    public static async Task<int> RunAsync(CancellationToken ct)
    {
        var root = FindRoot();
        var rows = new List<string>();
        foreach (
            var (where, dir) in new[] { ("tmpfs (/dev/shm)", "/dev/shm"), ("disk (temp folder)", Path.GetTempPath()) }
        )
        {
            if (!Directory.Exists(dir))
            {
                continue;
            }

            var db = Path.Combine(dir, $"sortrig-bench-drift-{Guid.NewGuid():N}.db");
            try
            {
                rows.AddRange(await RunOnceAsync(where, db, ct).ConfigureAwait(false));
            }
            finally
            {
                foreach (var f in new[] { db, db + "-wal", db + "-shm" }.Where(File.Exists))
                {
                    File.Delete(f);
                }
            }
        }

        var md = new List<string>
        {
            "# Drift logging benchmark",
            "",
            "Reproduce: `dotnet run -c Release --project bench/SortRig.Bench -- drift` (writes this file).",
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"Machine: {Environment.ProcessorCount} cores, .NET {Environment.Version}; shared with other jobs, "
                    + $"so wall times vary."
            ),
            "",
            "Run: 12.01 h of virtual time (`VirtualClock`; just past the 12 h mark), 4 parts on scanner channels "
                + "101-104 every 10 s,",
            "Pt100 on 105 read before and after the parts (6 readings per scan, 4324 scans, 25 944 samples), 10 kOhm "
                + "range, NPLC 10, 4-wire,",
            "batches of at most 64 samples. The simulator serves SCPI on a real TCP socket; the log is a real SQLite "
                + "file",
            "(WAL, synchronous=FULL). Managed memory = `GC.GetTotalMemory(true)` (after a full collection) and the "
                + "GC heap",
            "size after that collection (`GC.GetGCMemoryInfo().HeapSizeBytes`), sampled when virtual time passes "
                + "each hour.",
            "",
            "| storage | virtual time | samples read by then | managed memory (MiB) | GC heap (MiB) |",
            "| --- | --- | --- | --- | --- |",
        };
        md.AddRange(rows.Where(r => r.StartsWith('|')));
        md.Add("");
        md.AddRange(rows.Where(r => !r.StartsWith('|')));
        md.Add("");
        md.Add("The first run of the process includes JIT compilation, so its wall time is the longer one.");
        md.Add(
            "Memory is flat: the logger keeps one scan, the bounded channel (4 x batch size) and one batch; the "
                + "event hub"
        );
        md.Add(
            "keeps its last 512 events. What grows with the run is only the database file. The end-of-run analysis "
                + "reads the"
        );
        md.Add("samples back (a few hundred kB for this run) after the figures above were taken.");
        await File.WriteAllLinesAsync(Path.Combine(root, "docs", "bench-drift.md"), md, ct).ConfigureAwait(false);
        Console.WriteLine(string.Join('\n', md));
        return 0;
    }

    private static async Task<IEnumerable<string>> RunOnceAsync(string where, string db, CancellationToken ct)
    {
        var settings = new DriftOptions
        {
            Database = db,
            Run = "bench",
            Channels = "101-104",
            IntervalSeconds = 10,
            Hours = 12.01,
            Seed = 11,
        }.Validate();
        var clock = new VirtualClock(s_start);
        var services = new DriftServices(
            clock,
            TimeProvider.System,
            new BenchEventHub(clock),
            NullLoggerFactory.Instance
        );
        var marks = new List<string>();
        var hour = 1;
        var watch = Stopwatch.StartNew();
        var run = DriftRunner.RunAsync(settings, services, null, ct);
        await clock
            .DriveAsync(
                run,
                next =>
                {
                    while (hour <= 12 && next >= s_start.AddHours(hour))
                    {
                        var managed = GC.GetTotalMemory(forceFullCollection: true);
                        var heap = GC.GetGCMemoryInfo().HeapSizeBytes;
                        var samples = (long)Math.Round((next - s_start).TotalSeconds / 10) * 6;
                        if (hour is 1 or 2 or 4 or 6 or 8 or 10 or 12)
                        {
                            marks.Add(
                                string.Create(
                                    CultureInfo.InvariantCulture,
                                    $"| {where} | {hour} h | ~{samples} | {managed / 1048576.0:F2} | "
                                        + $"{heap / 1048576.0:F2} |"
                                )
                            );
                        }

                        hour++;
                    }
                },
                ct
            )
            .ConfigureAwait(false);
        var outcome = await run.ConfigureAwait(false);
        marks.Add(
            string.Create(
                CultureInfo.InvariantCulture,
                $"{where}: {outcome.Scans} scans, {outcome.SamplesStored} samples stored, {outcome.Gaps} gaps, wall "
                    + $"time {watch.Elapsed.TotalSeconds:F1} s ({outcome.Scans / watch.Elapsed.TotalSeconds:F0} "
                    + $"scans/s)."
            )
        );
        return marks;
    }

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(Directory.GetCurrentDirectory());
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("run from inside the SortRig repository");
    }
}
