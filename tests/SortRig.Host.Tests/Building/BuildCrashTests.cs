using SortRig.Host.Tests.Reliability.Support;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Building;

/// <summary>
/// A session sorting toward a build is killed with SIGKILL and restarted without naming the target again: it resumes
/// toward the same target (kept with the session, schema version 4), loses nothing and stops with the sets complete.
/// </summary>
[Collection(ReliabilityCollection.Name)]
public sealed class BuildCrashTests(ITestOutputHelper output) : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-buildcrash-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task Sort_KilledMidBuild_ResumesTowardTheSameTarget_NothingLost()
    {
        var db = Path.Combine(_dir, "build.db");
        var recipe = Path.Combine(_dir, "quad.yaml");
        var csv = Path.Combine(_dir, "sets.csv");
        await File.WriteAllTextAsync(recipe, QuadYaml);
        string[] common =
        [
            "sort",
            "--plain",
            "--no-speech",
            "--speed",
            "100",
            "--nplc",
            "10",
            "--db",
            db,
            "--session",
            "build",
            "--seed",
            "2026",
        ];

        var killed = await HostProcess.RunAsync(
            _dir,
            [.. common, "--recipe", recipe, "--sets", "2", "--sets-csv", csv],
            null,
            null,
            line => line.StartsWith("part 5:", StringComparison.Ordinal) ? TimeSpan.Zero : null,
            TimeSpan.FromMinutes(1)
        );
        Assert.True(killed.DiedOfSigkill, string.Join('\n', killed.Lines.TakeLast(10)));
        Assert.False(File.Exists(csv));

        var resumed = await HostProcess.RunAsync(_dir, common, null, null, null, TimeSpan.FromMinutes(1));
        output.WriteLine(string.Join('\n', resumed.Lines.Where(l => l.StartsWith("note:", StringComparison.Ordinal))));
        Assert.Equal(0, resumed.ExitCode);
        Assert.Contains(resumed.Lines, l =>
            l.Contains("resuming toward 2 set(s) of quad-crash (kept with the session)", StringComparison.Ordinal)
        );
        Assert.Contains(resumed.Lines, l =>
            l.Contains("sets complete: 2 set(s) of quad-crash", StringComparison.Ordinal)
        );
        Assert.True(File.Exists(csv));
        Assert.Contains(resumed.Lines, l => l.StartsWith("build: ", StringComparison.Ordinal)); // guidance in --plain

        await using var log = await PrecisionLogFactory.OpenAsync(db, null, default);
        var session = Assert.Single(await log.ListSessionsAsync(default));
        var parts = await log.GetPartsAsync(session.Id, default);
        // numbering ran on, nothing doubled
        Assert.Equal(Enumerable.Range(1, parts.Count), parts.Select(p => p.Number));
        Assert.All(parts, p => Assert.Equal(PartState.Announced, p.State)); // every part logged was announced
        Assert.True(parts.Count >= 5);
        var target = await log.GetBuildTargetAsync(session.Id, default);
        Assert.Equal((2, "quad-crash"), (target!.Sets, target.RecipeName));

        // The exported sets: disjoint, each meeting 1000 ppm worst case by the matched-form rule (docs/planning.md),
        // recomputed here from the logged values.
        var rows = (await File.ReadAllLinesAsync(csv)).Skip(1).Select(l => l.Split(',')).ToList();
        var byId = parts.ToDictionary(p => p.Id);
        Assert.Equal(8, rows.Select(r => r[3]).Distinct().Count());
        foreach (var set in rows.GroupBy(r => r[0]))
        {
            var members = set.Select(r => byId[long.Parse(r[3], System.Globalization.CultureInfo.InvariantCulture)])
                .ToList();
            Assert.True(
                MatchedBruteForce.WorstPpm(members.Select(p => (p.Value, p.Measured.ExpandedTransfer)), 10_000) <= 1000
            );
        }
    }

    // Invented test recipe.
    private const string QuadYaml = """
        recipe: quad-crash
        form: matched
        match-ppm: 1000
        base: 10k
        positions:
          - { name: R1, ratio: 1 }
          - { name: R2, ratio: 1 }
          - { name: R3, ratio: 1 }
          - { name: R4, ratio: 1 }
        """;
}
