using System.Globalization;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Host.Tests.Reliability.Support;
using SortRig.Simulator;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Reliability;

/// <summary>
/// Crash points: the sort process is killed with SIGKILL again and again — during the schema
/// migration (strace stops it at a write to the WAL), between a settled reading and its commit,
/// between commit and announcement, between announcement and its mark in the log, and at random
/// moments — and restarted each time. At the end nothing accepted is lost or doubled, no part was
/// ever announced with two cups, numbering ran on, and the database passes integrity_check.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class CrashTests(ITestOutputHelper output) : IDisposable
{
    private const int Parts = 50;
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-crash-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_KilledAtRandomPointsAndRestarted_NothingLostNothingDoubled()
    {
        var seed = int.TryParse(Environment.GetEnvironmentVariable("SORTRIG_CRASH_SEED"), out var s) ? s : 3113;
        var rng = new Random(seed);
        var db = Path.Combine(_dir, "crash.db");
        var plan = CrashPlan.Make(rng, migrationKills: HostProcess.StraceAvailable ? 4 : 0);
        if (!HostProcess.StraceAvailable)
        {
            Assert.False(
                Environment.GetEnvironmentVariable("CI") == "true",
                "strace is needed for the migration crash points on CI"
            );
            output.WriteLine("strace not installed: migration crash points skipped (apt-get install strace)");
        }

        var runs = new List<(CrashPlan.Step Step, HostRun Run)>();
        foreach (var step in plan.Append(CrashPlan.Step.Finish))
        {
            var run = await HostProcess.RunAsync(
                _dir,
                Args(db, seed),
                step.CrashAt,
                step.Strace(db),
                step.KillAfter(rng),
                TimeSpan.FromMinutes(1)
            );
            runs.Add((step, run));
            output.WriteLine(
                $"{step.Kind, -10} {step.Detail, -12} exit {run.ExitCode, 3}  heard "
                    + $"{Announcements.Cups(string.Join('\n', run.Lines)).Count}"
            );
            if (step.Kind == "finish" || run.ExitCode == 0)
            {
                Assert.Equal(0, run.ExitCode);
                break;
            }

            Assert.True(
                run.DiedOfSigkill,
                $"{step.Kind} {step.Detail}: exit {run.ExitCode}\n{string.Join('\n', run.Lines.TakeLast(15))}"
            );
        }

        var kills = runs.Where(r => r.Run.DiedOfSigkill).ToList();
        Assert.True(kills.Count >= 20, $"only {kills.Count} kills before the reel ended");

        // Every kill during the migration left the store unmigrated: none of those runs finished it,
        // and the first run after them applied migration 1 again.
        const string migrated = "Applied schema migration 1";
        Assert.All(runs.Where(r => r.Step.Kind == "migration"), r =>
            Assert.DoesNotContain(migrated, r.Run.Log, StringComparison.Ordinal)
        );
        Assert.Contains(migrated, runs.First(r => r.Step.Kind != "migration").Run.Log, StringComparison.Ordinal);

        await AssertNothingLostAsync(db, seed, runs.Select(r => r.Run).ToList());
        var report = string.Join(", ", kills.GroupBy(k => k.Step.Kind).Select(g => $"{g.Key} {g.Count()}"));
        output.WriteLine($"kills: {kills.Count} ({report}), seed {seed}");
        SoakSettings.Report(
            string.Create(CultureInfo.InvariantCulture, $"| crash | {Parts} | {kills.Count} | {report} | seed {seed} |")
        );
    }

    private static string[] Args(string db, int seed) =>
        [
            "sort",
            "--plain",
            "--no-speech",
            "--speed",
            "100",
            "--nplc",
            "10",
            "--parts",
            Parts.ToString(CultureInfo.InvariantCulture),
            "--db",
            db,
            "--session",
            "crash",
            "--seed",
            seed.ToString(CultureInfo.InvariantCulture),
        ];

    private async Task AssertNothingLostAsync(string db, int seed, IReadOnlyList<HostRun> runs)
    {
        DatabaseChecks.AssertIntegrity(db);
        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        Assert.True((await log.VerifyAsync(default)).IsOk);
        var session = Assert.Single(await log.ListSessionsAsync(default), x => x.Name == "crash");
        var parts = await log.GetPartsAsync(session.Id, default);
        Assert.Equal(Enumerable.Range(1, Parts), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State));
        foreach (var p in parts)
        {
            Assert.True((await log.GetReadingsAsync(p.Id, default)).Count >= 8, $"part {p.Number} lost its readings");
        }

        // Every announcement matches the stored cup; so no part was ever announced with two cups.
        var heard = runs.SelectMany(r => Announcements.Cups(string.Join('\n', r.Lines))).ToList();
        var cups = parts.ToDictionary(p => p.Number, p => p.CupLabel);
        Assert.All(heard, h => Assert.Equal(cups[h.Part], h.Cup));

        // Numbering ran on: in the order first heard, the parts are 1, 2, 3 ... with no gap and none
        // out of turn (a part committed but not announced before a kill is said first after the restart).
        Assert.Equal(Enumerable.Range(1, Parts), heard.Select(h => h.Part).Distinct());

        // The values and cups are those of the reel's true values (simulator truth, same seed).
        var options = new SortOptions
        {
            Parts = Parts,
            Seed = seed,
            Nplc = 10,
        };
        await using var bench = new SimulatedBench(DemoBench.For(options, Parts));
        var (problems, onEdge) = TruthCheck.Compare(options, parts, n => bench.Truth(n - 1));
        output.WriteLine(
            $"{heard.Count} announcements, {heard.Count(h => h.Repeated)} repeated after a restart, {onEdge} on a "
                + $"band edge"
        );
        Assert.Empty(problems);
    }
}
