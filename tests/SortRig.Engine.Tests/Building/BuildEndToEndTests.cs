using SortRig.Engine.Sorting;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;
using Xunit.Abstractions;

namespace SortRig.Engine.Tests.Building;

/// <summary>
/// Sorting toward a build end to end, in-process, over the simulator's SCPI socket with a real SQLite file: a
/// two-nominal ladder section (two R, two 2R) sorted as an R batch then a 2R batch in one session, with the range
/// transfer. The outside reference is the simulator's truth side channel (each part's true value).
/// </summary>
public sealed class BuildEndToEndTests(ITestOutputHelper output) : IDisposable
{
    private const int Sets = 2;
    private const int RParts = 8;
    private readonly string _dir = Directory.CreateTempSubdirectory("sortrig-build-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public async Task LadderSession_StopsWithTheSetsComplete_PickListMeetsTheSpecOnTheTruth()
    {
        var recipePath = Path.Combine(_dir, "ladder-pair.yaml");
        await File.WriteAllTextAsync(recipePath, BuildParts.LadderPairYaml);
        var csv = Path.Combine(_dir, "sets.csv");
        var session = new RangeTransferSession(Path.Combine(_dir, "build.db"));

        var r = Toward(session.Options(10_000, RParts, BridgeMode.Always), recipePath, csv);
        var first = await session.RunAsync(r);
        Assert.False(first.Outcome!.Build!.Complete); // no 2R yet: the counts alone say no
        Assert.Contains("feed 20k next", first.Outcome.Build.Line, StringComparison.Ordinal);
        Assert.False(File.Exists(csv));

        var twoR = Toward(session.Options(20_000, 60, BridgeMode.Always), recipePath, csv);
        twoR.Reopen = true;
        var second = await session.RunAsync(twoR);
        output.WriteLine(
            string.Join('\n', second.Heard.Split('\n').Where(l => l.StartsWith("note:", StringComparison.Ordinal)))
        );

        var build = second.Outcome!.Build!;
        Assert.True(build.Complete, build.Line);
        Assert.Contains("sets complete: 2 set(s) of ladder-pair", second.Heard, StringComparison.Ordinal);
        Assert.True(second.Outcome.PartsRecorded < 60, "the session stopped before the reel ended");
        Assert.Equal(csv, build.CsvPath);

        await using var log = await PrecisionLogFactory.OpenAsync(r.Database, null, default);
        var parts = (await log.GetPartsAsync(second.Outcome.SessionId, default)).ToDictionary(p => p.Id);
        var plan = build.Plan!;
        Assert.Equal(Sets, plan.List.Sets.Count);
        var lines = await File.ReadAllLinesAsync(csv);
        Assert.Equal(1 + (4 * Sets), lines.Length); // header + one row per position

        // Every set against the truth: true ratio spread max(t/n)/min(t/n) − 1 within the recipe's 2000 ppm (the
        // matched-form rule, docs/planning.md). Truth is by reel index = part number − 1, from the run whose reel held
        // it.
        foreach (var set in plan.List.Sets)
        {
            var q = set
                .Items.Select(i => parts[i.PartId!.Value])
                .Select(p => (p.Nominal == 10_000 ? first.Bench : second.Bench).Truth(p.Number - 1) / p.Nominal)
                .ToList();
            var spreadPpm = ((q.Max() / q.Min()) - 1) * 1e6;
            output.WriteLine(
                $"set {set.Number}: parts {string.Join(", ", set.Items.Select(i => i.PartId))}, true spread "
                    + $"{spreadPpm:F0} ppm, stated worst case {set.Outputs[0].WorstCaseError:F0} ppm"
            );
            Assert.InRange(spreadPpm, 0, 2000);
            Assert.Equal(2, set.Items.Count(i => i.Nominal == 10_000));
            Assert.Equal(2, set.Items.Count(i => i.Nominal == 20_000));
        }

        // Nothing sorted after the sets were in hand: the last part is in a set or the sets could not be made without
        // it.
        Assert.Equal(second.Outcome.PartsRecorded, parts.Values.Max(p => p.Number));
        Assert.All(parts.Values, p => Assert.Equal(PartState.Announced, p.State));
    }

    private static SortOptions Toward(SortOptions o, string recipe, string csv)
    {
        o.Recipe = recipe;
        o.Sets = Sets;
        o.SetsCsv = csv;
        return o;
    }
}
