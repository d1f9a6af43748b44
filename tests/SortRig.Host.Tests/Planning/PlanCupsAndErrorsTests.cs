using System.CommandLine;
using SortRig.Engine.Picking;
using SortRig.Host.Cli;
using SortRig.Host.LibraryVerb;
using SortRig.Host.PlanVerb;
using SortRig.Host.Tests.Library;
using SortRig.Host.VerbSupport;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.Planning;

/// <summary>The plan verb on a session sorted into cups, across sessions (library sets), and its errors.</summary>
public sealed class PlanCupsAndErrorsTests
{
    private const double Tolerance = 1000;

    // Invented cup contents of a band-sorted 10 kOhm reel (transfer u 10 ppm): A holds eight close parts, B five spread
    // wider than the tolerance, C three, and the reject cup six close ones (rejects are never offered).
    private static readonly SeedPart[] s_cups =
    [
        .. new double[] { 100, 140, 180, 220, 260, 300, 350, 400 }.Select(p => new SeedPart(p, 10, "A")),
        .. new double[] { -700, -400, 0, 300, 500 }.Select(p => new SeedPart(p, 10, "B")),
        .. new double[] { -200, -150, -100 }.Select(p => new SeedPart(p, 10, "C")),
        .. new double[] { 9000, 9010, 9020, 9030, 9040, 9050 }.Select(p => new SeedPart(p, 10, "R")),
    ];

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Plan_SessionInCups_PicksByCupAndEverySetHoldsForAnyPartsOfItsCups(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var parts = await Seed.SessionAsync(store, "cups", s_cups);
        // Expected, independently: a quad takes four parts of one cup; a cup gives floor(count / 4) quads when all its
        // parts together meet the rule, none otherwise; the reject cup gives none.
        var expected = parts
            .Where(p => p.CupLabel != "R")
            .GroupBy(p => p.CupLabel)
            .Sum(g =>
                MatchedBruteForce.WorstPpm(g.Select(p => (p.Value, p.Measured.ExpandedTransfer)), 10_000) <= Tolerance
                    ? g.Count() / 4
                    : 0
            );
        var csv = store.File("cups.csv");
        var io = new ConsoleCapture();

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "cups", PlanVerbTests.Recipe, csv),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        Assert.Equal(2, expected);
        var rows = PlanVerbTests.ReadPickCsv(csv);
        Assert.Equal(expected, rows.Select(r => r.Set).Distinct().Count());
        Assert.All(rows, r => Assert.Equal(("", "cup A"), (r.Part, r.Source)));
        Assert.Contains("by cup", io.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Plan_TwoNominalsEachWithCupA_PicksByCupPerNominal()
    {
        // Each batch of a session labels its cups from A, so the 1 kOhm, 2 kOhm and 4 kOhm batches of the ratio set
        // all have a cup A (invented values within 100 ppm of nominal). Cups are told apart by nominal, not label.
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        await Seed.SessionAsync(
            store,
            "gain-set",
            [
                .. new double[] { -50, 40 }.Select(p => new SeedPart(p, 10, "A", Nominal: 1_000)),
                .. new double[] { -60, -20, 30, 70 }.Select(p => new SeedPart(p, 10, "A", Nominal: 2_000)),
                .. new double[] { -30, 60 }.Select(p => new SeedPart(p, 10, "A", Nominal: 4_000)),
            ]
        );
        var csv = store.File("gain.csv");
        var io = new ConsoleCapture();

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "gain-set", "ratio-set", csv),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        // Two sets: each takes 1 kOhm, 2 kOhm twice and 4 kOhm, all from the cups A of their nominals; the widest
        // worst case is (70 + 10) - (-60 - 10) = 150 ppm, inside the recipe's 500 ppm (common practice, no source).
        var rows = PlanVerbTests.ReadPickCsv(csv);
        Assert.Equal(2, rows.Select(r => r.Set).Distinct().Count());
        Assert.All(rows, r => Assert.Equal("cup A", r.Source));
        Assert.Contains("by cup", io.Text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task LibrarySets_AcrossTwoSessions_CountsLikeTheBruteForceOverBoth(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var first = await Seed.SessionAsync(
            store,
            "reel-1",
            [
                .. new double[] { -300, -100, 100, 300, 900, 1500 }.Select(
                    (p, i) => new SeedPart(p, 10, Slot: $"T1-A{i + 1:00}")
                ),
            ]
        );
        var second = await Seed.SessionAsync(
            store,
            "reel-2",
            [
                .. new double[] { -200, 0, 200, 1200, 1300 }.Select(
                    (p, i) => new SeedPart(p, 10, Slot: $"T2-A{i + 1:00}")
                ),
            ]
        );
        var all = first.Concat(second).ToList();
        var expected = MatchedBruteForce.MaxDisjoint(
            all.Select(p => (p.Value, p.Measured.ExpandedTransfer)).ToList(),
            4,
            10_000,
            Tolerance
        );
        Assert.True(expected >= 2, "test data should need parts of both sessions");
        var csv = store.File("sets.csv");

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, null, "matched-quad", csv),
            new ConsoleCapture().Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var rows = PlanVerbTests.ReadPickCsv(csv);
        Assert.Equal(expected, rows.Select(r => r.Set).Distinct().Count());
        // Parts of several sessions: slots carry their session, since T1-A01 of one reel is not of another.
        Assert.All(rows, r => Assert.Matches(@"^S\d+ T[12]-A\d\d$", r.Source));
    }

    [Fact]
    public async Task Plan_UnknownSession_ExitsTwoListingTheSessions()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        await Seed.SessionAsync(store, "quad-reel", [new SeedPart(0, 10, "A")]);
        var io = new ConsoleCapture();

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "nope", PlanVerbTests.Recipe),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.BadInput, code);
        Assert.Contains("no session named or numbered 'nope'", io.Text, StringComparison.Ordinal);
        Assert.Contains("'quad-reel' (id 1)", io.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Plan_BrokenRecipe_ExitsTwoNamingFileLineAndField()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var recipe = store.File("broken.yaml");
        await File.WriteAllTextAsync(
            recipe,
            "recipe: q\nform: matched\nmatch-ppm: -5\npositions:\n  - { name: R1, nominal: 10k }\n"
        );
        var io = new ConsoleCapture();

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "any", recipe),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.BadInput, code);
        Assert.Contains("broken.yaml:3:12: match-ppm: expected", io.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Plan_CupsForANetworkRecipe_IsRefusedWithAHint()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        await Seed.SessionAsync(store, "s", [new SeedPart(0, 10, "A")]);
        var io = new ConsoleCapture();

        var code = await PlanRunner.RunAsync(
            new PlanRequest(store.Database, "s", "diff-amp-g1", Mode: PickMode.Cups),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.BadInput, code);
        Assert.Contains("--pick parts", io.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task PlanCommand_ParsedFromArguments_WritesTheCsvAndExitsZero()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        await Seed.SessionAsync(
            store,
            "quad-reel",
            [.. new double[] { 0, 10, 20, 30 }.Select((p, i) => new SeedPart(p, 10, $"T1-A{i + 1:00}"))]
        );
        var csv = store.File("parsed.csv");
        var io = new ConsoleCapture();
        var root = new RootCommand { PlanCommand.Create(io.Console) };

        var code = await root.Parse([
                "plan",
                "--db",
                store.Database,
                "--session",
                "1",
                "--recipe",
                PlanVerbTests.Recipe,
                "--csv",
                csv,
                "--pick",
                "parts",
            ])
            .InvokeAsync();

        Assert.Equal(0, code);
        Assert.Single(PlanVerbTests.ReadPickCsv(csv).Select(r => r.Set).Distinct());
    }
}
