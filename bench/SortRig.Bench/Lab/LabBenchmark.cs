using System.Diagnostics;
using System.Globalization;
using SortRig.Storage;
using SortRig.Storage.Lab;

namespace SortRig.Bench.Lab;

/// <summary>
/// `lab` benchmark: parts committed per second by 1, 2, 4 and 8 benches (separate processes) writing at once to one
/// PostgreSQL server as the lab's writer role, and by one bench on a SQLite file, on this machine. Starts its own
/// PostgreSQL server with fsync on (scripts/pg-test-server, SORTRIG_PG_FSYNC=on) and stops it. Writes
/// docs/bench-lab.md.
/// </summary>
internal static class LabBenchmark
{
    private const double Seconds = 10;

    public static async Task<int> RunAsync(CancellationToken ct)
    {
        var root = FindRoot();
        var loadBefore = LoadAverage();
        var serverDir = Path.Combine(Path.GetTempPath(), "sortrig-bench-lab-" + Guid.NewGuid().ToString("N")[..8]);
        var rows = new List<string>();
        var admin = (await ScriptAsync(root, "start", serverDir, ct).ConfigureAwait(false)).Trim();
        try
        {
            var names = new LabRoleNames("bench_owner", "bench_writer", "bench_lab");
            await LabRoles.ApplyAsync(admin, names, ct).ConfigureAwait(false);
            await using (
                await PrecisionLogFactory
                    .OpenAsync(
                        admin.Replace("Username=sortrig", "Username=bench_owner", StringComparison.Ordinal),
                        null,
                        ct
                    )
                    .ConfigureAwait(false)
            )
            {
                // The owner migrates.
            }

            var writer = admin.Replace("Username=sortrig", "Username=bench_writer", StringComparison.Ordinal);
            foreach (var benches in new[] { 1, 2, 4, 8 })
            {
                rows.Add(
                    await MeasureAsync($"PostgreSQL 15 (fsync on), writer role", benches, writer, $"pg{benches}", ct)
                        .ConfigureAwait(false)
                );
            }
        }
        finally
        {
            await ScriptAsync(root, "stop", serverDir, ct).ConfigureAwait(false);
            Directory.Delete(serverDir, recursive: true);
        }

        var sqlite = Path.Combine(Path.GetTempPath(), $"sortrig-bench-lab-{Guid.NewGuid():N}.db");
        try
        {
            rows.Add(
                await MeasureAsync("SQLite (WAL, synchronous=FULL)", 1, sqlite, "sqlite1", ct).ConfigureAwait(false)
            );
        }
        finally
        {
            foreach (var f in new[] { sqlite, sqlite + "-wal", sqlite + "-shm" }.Where(File.Exists))
            {
                File.Delete(f);
            }
        }

        var loadAfter = LoadAverage();
        var md = new List<string>
        {
            "# Lab benchmark: many benches on one PostgreSQL server",
            "",
            "Reproduce: `dotnet run -c Release --project bench/SortRig.Bench -- lab` (writes this file; starts and "
                + "stops its own server).",
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"Machine: {Environment.ProcessorCount} cores, .NET {Environment.Version}; shared with other jobs, "
                    + $"so the figures vary; the server, the benches and everything else share the same cores."
            ),
            "",
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"Each bench is its own process (like a bench PC) with its own session, committing parts one after "
                    + $"another for {Seconds:0} s"
            ),
            "after a common start signal (warm-up parts before it): each part is one transaction with its row and 12 "
                + "raw readings,",
            "committed before the next, as the sorting loop does. PostgreSQL: a throw-away server on the same "
                + "machine, same disk,",
            "fsync and full_page_writes on, benches logged in as the writer role over TCP on 127.0.0.1. SQLite: one "
                + "bench on a file",
            "in the temp folder on the same disk. Rate = parts committed by all benches / the longest bench's time.",
            $"Load average (1 min) before and after the run: {loadBefore} / {loadAfter} (other helpers' builds and "
                + $"tests on the same 2 cores).",
            "",
            "| store | benches | parts committed | parts/s (all benches) | parts/s per bench | commit p50 (ms) | "
                + "commit p95 (ms, worst bench) |",
            "| --- | --- | --- | --- | --- | --- | --- |",
        };
        md.AddRange(rows);
        md.Add("");
        md.Add(
            "More benches than cores: beyond 2 benches the processes, the server and the machine's other work take "
                + "turns on"
        );
        md.Add(
            "2 cores, so the total stays flat or dips and each bench's commit takes longer (p95 a few hundred ms); "
                + "no commit"
        );
        md.Add(
            "failed (a failing worker stops the run). SQLite in-process needs no round trips (one bench only: it is "
                + "a file on one machine)."
        );
        md.Add("");
        md.Add(
            "A sorting bench commits a part every few seconds (a settled reading at NPLC 1-10 plus handling), so "
                + "even the"
        );
        md.Add(
            "slowest row leaves the server idle most of the time: eight benches at one part per 3 s need under 3 "
                + "parts/s, about"
        );
        md.Add(
            "a twentieth of what the 8-bench row committed here. The lab's limit is not the server but the operators."
        );
        await File.WriteAllLinesAsync(Path.Combine(root, "docs", "bench-lab.md"), md, ct).ConfigureAwait(false);
        Console.WriteLine(string.Join('\n', md));
        return 0;
    }

    private static async Task<string> MeasureAsync(
        string store,
        int benches,
        string database,
        string prefix,
        CancellationToken ct
    )
    {
        var workers = new List<Process>();
        try
        {
            for (int i = 0; i < benches; i++)
            {
                var start = new ProcessStartInfo("dotnet")
                {
                    RedirectStandardInput = true,
                    RedirectStandardOutput = true,
                    UseShellExecute = false,
                };
                foreach (
                    var a in new[]
                    {
                        typeof(LabBenchmark).Assembly.Location,
                        "lab-worker",
                        database,
                        $"{prefix}-bench-{i + 1}",
                        Seconds.ToString(CultureInfo.InvariantCulture),
                    }
                )
                {
                    start.ArgumentList.Add(a);
                }

                workers.Add(Process.Start(start) ?? throw new InvalidOperationException("worker did not start"));
            }

            foreach (var w in workers)
            {
                var line = await w.StandardOutput.ReadLineAsync(ct).ConfigureAwait(false);
                if (line != "ready")
                {
                    throw new InvalidOperationException($"worker said '{line}' instead of ready");
                }
            }

            foreach (var w in workers)
            {
                await w.StandardInput.WriteLineAsync("go").ConfigureAwait(false);
                await w.StandardInput.FlushAsync(ct).ConfigureAwait(false);
            }

            var done = new List<(int Count, double Seconds, double P50, double P95)>();
            foreach (var w in workers)
            {
                var line = await w.StandardOutput.ReadLineAsync(ct).ConfigureAwait(false)
                    ?? throw new InvalidOperationException("worker ended without a result");
                var f = line.Split(' ');
                done.Add(
                    (
                        int.Parse(f[1], CultureInfo.InvariantCulture),
                        double.Parse(f[2], CultureInfo.InvariantCulture),
                        double.Parse(f[3], CultureInfo.InvariantCulture),
                        double.Parse(f[4], CultureInfo.InvariantCulture)
                    )
                );
                await w.WaitForExitAsync(ct).ConfigureAwait(false);
            }

            int parts = done.Sum(d => d.Count);
            double rate = parts / done.Max(d => d.Seconds);
            var p50 = done.Select(d => d.P50).Order().ToList()[done.Count / 2];
            return string.Create(
                CultureInfo.InvariantCulture,
                $"| {store} | {benches} | {parts} | {rate:F0} | {rate / benches:F0} | {p50:F1} | "
                    + $"{done.Max(d => d.P95):F1} |"
            );
        }
        finally
        {
            foreach (var w in workers)
            {
                if (!w.HasExited)
                {
                    w.Kill(entireProcessTree: true);
                }

                w.Dispose();
            }
        }
    }

    private static async Task<string> ScriptAsync(string root, string verb, string dir, CancellationToken ct)
    {
        var start = new ProcessStartInfo("bash")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(Path.Combine(root, "scripts", "pg-test-server"));
        start.ArgumentList.Add(verb);
        start.ArgumentList.Add(dir);
        start.Environment["SORTRIG_PG_FSYNC"] = "on";
        start.Environment["SORTRIG_PG_PORT"] = "56432";
        using var process = Process.Start(start) ?? throw new InvalidOperationException("bash did not start");
        var output = process.StandardOutput.ReadToEndAsync(ct);
        var error = process.StandardError.ReadToEndAsync(ct);
        await process.WaitForExitAsync(ct).ConfigureAwait(false);
        if (process.ExitCode != 0)
        {
            throw new InvalidOperationException($"pg-test-server {verb}: {await error.ConfigureAwait(false)}");
        }

        return await output.ConfigureAwait(false);
    }

    private static string LoadAverage() =>
        File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Split(' ')[0] : "n/a";

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
