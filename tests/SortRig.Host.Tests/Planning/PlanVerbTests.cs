using CsvHelper;
using SortRig.Host.LibraryVerb;
using SortRig.Host.PlanVerb;
using SortRig.Host.Tests.Library;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.Planning;

/// <summary>The plan verb on real stores: a seeded session, a shipped recipe, the verb run in-process.</summary>
public sealed class PlanVerbTests
{
    private const double Tolerance = 1000; // recipes/matched-quad.yaml: match-ppm 1000

    // Thirteen slotted 10 kOhm parts, transfer u 10 ppm (U = 20 ppm): invented, chosen so several quads compete.
    private static readonly SeedPart[] s_slotted = new double[]
    {
        -1400,
        -900,
        -700,
        -650,
        -300,
        -250,
        -200,
        -100,
        0,
        50,
        400,
        450,
        900,
    }
        .Select((ppm, i) => new SeedPart(ppm, 10, Cup: $"T1-A{i + 1:00}"))
        .ToArray();

    internal static string Recipe => Path.Combine(RepoRoot(), "recipes", "matched-quad.yaml");

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Plan_QuadOnSlottedSession_MakesTheSetsABruteForceCountsAndTheCsvReadsBack(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var parts = await Seed.SessionAsync(store, "quad-reel", s_slotted);
        var expected = MatchedBruteForce.MaxDisjoint(
            parts.Select(p => (p.Value, p.Measured.ExpandedTransfer)).ToList(),
            4,
            10_000,
            Tolerance
        );
        Assert.True(expected >= 2, "test data should allow at least two quads");

        var io = new ConsoleCapture();
        var csv = store.File("picks.csv");
        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "quad-reel", Recipe, csv),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var rows = ReadPickCsv(csv);
        var sets = rows.GroupBy(r => r.Set).ToList();
        Assert.Equal(expected, sets.Count);
        Assert.Contains($"{expected} set(s) of matched-quad", io.Text, StringComparison.Ordinal);
        var byId = parts.ToDictionary(p => p.Id);
        Assert.Equal(rows.Count, rows.Select(r => r.Part).Distinct().Count());
        foreach (var set in sets)
        {
            Assert.Equal(4, set.Count());
            var members = set.Select(r => byId[long.Parse(r.Part, System.Globalization.CultureInfo.InvariantCulture)])
                .ToList();
            Assert.True(
                MatchedBruteForce.WorstPpm(members.Select(p => (p.Value, p.Measured.ExpandedTransfer)), 10_000)
                    <= Tolerance
            );
            Assert.All(set, r =>
                Assert.Equal(
                    byId[long.Parse(r.Part, System.Globalization.CultureInfo.InvariantCulture)].CupLabel,
                    r.Source
                )
            );
        }
    }

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Plan_Take_MarksThePickedPartsTaken_AndASecondTakeIsRefusedNamingThem(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        await Seed.SessionAsync(store, "quad-reel", s_slotted);
        var csv = store.File("picks.csv");

        var first = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "quad-reel", Recipe, csv, TakeBy: "alice"),
            new ConsoleCapture().Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, first);
        var ids = ReadPickCsv(csv)
            .Select(r => long.Parse(r.Part, System.Globalization.CultureInfo.InvariantCulture))
            .ToList();
        Assert.NotEmpty(ids);
        await using (var log = await store.OpenAsync())
        {
            foreach (var id in ids)
            {
                var p = await log.GetPartAsync(id, CancellationToken.None);
                Assert.Equal((LibraryStatus.Taken, "alice"), (p!.LibraryStatus, p.TakenBy));
            }
        }

        var io = new ConsoleCapture();
        var second = await LibraryMoves.RunAsync(
            new MoveRequest(store.Database, LibraryMove.Take, ids, "bob"),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Refused, second);
        Assert.Contains("take refused, nothing changed", io.Text, StringComparison.Ordinal);
        Assert.All(ids, id => Assert.Contains($"{id} (Taken by alice)", io.Text, StringComparison.Ordinal));
        await using var check = await store.OpenAsync();
        var after = await check.FindPartsAsync(new LibraryQuery(Status: LibraryStatus.Taken), CancellationToken.None);
        Assert.Equal(ids.Order(), after.Select(p => p.Id).Order());
        Assert.All(after, p => Assert.Equal("alice", p.TakenBy));
    }

    internal static List<(string Set, string Part, string Source)> ReadPickCsv(string path)
    {
        using var reader = CsvReader.FromFile(path, null);
        var rows = new List<(string, string, string)>();
        while (reader.Read())
        {
            rows.Add((reader.GetString("set"), reader.GetString("part"), reader.GetString("source")));
        }

        return rows;
    }

    internal static string RepoRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("repository root not found");
    }
}
