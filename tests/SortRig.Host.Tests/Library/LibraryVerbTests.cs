using System.Globalization;
using CsvHelper;
using SortRig.Host.Cli;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Tests.Library;

/// <summary>The library verbs on real stores, seeded through IPrecisionLog and run in-process.</summary>
public sealed class LibraryVerbTests
{
    // Invented 10 kOhm parts (deviation ppm); none lies on the search bounds used below.
    private static readonly double[] s_ppm = [-950, -480, -120, -10, 35, 260, 499, 780, 1210];

    private static SeedPart[] Parts => [.. s_ppm.Select((p, i) => new SeedPart(p, 10, Slot: $"T1-B{i + 1:00}"))];

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Find_ByDeviationWindow_ListsExactlyThePartsInside(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        await Seed.SessionAsync(store, "other-nominal", [new SeedPart(100, 10, Nominal: 20_000)]);
        var expected = parts.Where(p => p.DeviationPpm is >= -500 and <= 500).Select(p => p.Id).Order().ToList();
        var io = new ConsoleCapture();

        var code = await LibraryFind.RunAsync(
            new FindRequest(store.Database, "10k", -500, 500),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        Assert.Equal(6, expected.Count);
        Assert.Equal(expected, IdsListed(io.Text).Order());
        Assert.Contains($"{expected.Count} part(s).", io.Text, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Labels_Text_HoldEachPartsValuesInFixedWidthLines(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        await using (var log = await store.OpenAsync())
        {
            // 10 000.123 45 Ohm, u = 0.012 05 Ohm, so U (k = 2) = 0.0241 Ohm: two significant digits give "0.024" and
            // the value to the same place, "10000.123" (JCGM 100:2008 sec. 7.2.6 rounding; figures invented).
            var s = await log.OpenOrResumeSessionAsync(new SessionRequest("labels"), CancellationToken.None);
            var b = await log.StartBatchAsync(
                s.Session.Id,
                new BatchSetup(10_000, 10_000, 1_000, 100_000, 10, true, "sim", "SORTRIG,SIM,1,1"),
                CancellationToken.None
            );
            var p = await log.CommitPartAsync(
                new PartCommit(
                    Guid.NewGuid(),
                    s.Session.Id,
                    b.Id,
                    new(10_000.12345, 0.01205, 0.002),
                    100_000,
                    10,
                    22.8,
                    Seed.At,
                    null,
                    "T1-A07",
                    []
                ),
                CancellationToken.None
            );
            await log.SetLocationAsync(p.Id, "bag 7", CancellationToken.None);
        }

        await Seed.SessionAsync(store, "labels", [new SeedPart(-480, 10, Slot: "T1-A08")]);
        var io = new ConsoleCapture();

        var code = await LibraryLabels.RunAsync(
            store.Database,
            [1, 2],
            "text",
            null,
            io.Console,
            io.Stdout,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var labels = io.Stdout.ToString().Split("\n\n", StringSplitOptions.RemoveEmptyEntries);
        Assert.Equal(2, labels.Length);
        var first = labels[0].Split('\n');
        Assert.All(labels.SelectMany(l => l.Split('\n')), line => Assert.Equal(32, line.Length));
        Assert.Equal(5, first.Length);
        Assert.StartsWith("#1 ", first[0], StringComparison.Ordinal);
        Assert.EndsWith("10 kOhm", first[0], StringComparison.Ordinal);
        Assert.Equal("R 10000.123 Ohm", first[1].TrimEnd());
        Assert.Equal("U 0.024 Ohm (k=2)", first[2].TrimEnd());
        // (10000.12345 / 10000 - 1) 1e6 = 12.345
        Assert.StartsWith("dev +12.3 ppm", first[3], StringComparison.Ordinal);
        Assert.EndsWith("at 22.8 degC", first[3], StringComparison.Ordinal);
        Assert.Equal("2026-03-02  bag 7", first[4].TrimEnd());
        Assert.Contains("dev -480.0 ppm", labels[1], StringComparison.Ordinal);
        Assert.Contains("T1-A08", labels[1], StringComparison.Ordinal);
    }

    [Fact]
    public async Task Labels_Csv_ReadBackWithEveryPartsValues()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        var file = store.File("labels.csv");

        var code = await LibraryLabels.RunAsync(
            store.Database,
            [.. parts.Select(p => p.Id)],
            "csv",
            file,
            new ConsoleCapture().Console,
            TextWriter.Null,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        using var reader = CsvReader.FromFile(file, null);
        var rows = new List<(long Id, double Value, double U, string Where)>();
        while (reader.Read())
        {
            rows.Add(
                (
                    long.Parse(reader.GetString("id"), CultureInfo.InvariantCulture),
                    double.Parse(reader.GetString("value_ohm"), CultureInfo.InvariantCulture),
                    double.Parse(reader.GetString("expanded_u_ohm"), CultureInfo.InvariantCulture),
                    reader.GetString("location")
                )
            );
        }

        Assert.Equal(LibraryLabels.Columns, reader.Headers);
        Assert.Equal(parts.Select(p => (p.Id, p.Value, p.Measured.Expanded, p.SlotLabel!)), rows);
    }

    [Theory]
    [InlineData(StoreEngine.Sqlite)]
    [PostgresData]
    public async Task Export_Csv_ReadsBackEveryLivePartWithItsStatus(StoreEngine engine)
    {
        await using var store = await TestStore.CreateAsync(engine);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        await using (var log = await store.OpenAsync())
        {
            await log.TakePartsAsync([parts[0].Id, parts[1].Id], "mira", CancellationToken.None);
            await log.RetireAsync([parts[2].Id], "cracked", CancellationToken.None);
            await log.UndoPartAsync(new PartCorrection(parts[3].Id, PartCorrectionKind.Undo), CancellationToken.None);
        }

        var file = store.File("library.csv");
        var code = await LibraryExport.RunAsync(
            store.Database,
            file,
            null,
            null,
            new ConsoleCapture().Console,
            TextWriter.Null,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        using var reader = CsvReader.FromFile(file, null);
        var rows = new Dictionary<long, (double Value, string Status, string TakenBy, string Slot)>();
        while (reader.Read())
        {
            rows[long.Parse(reader.GetString("id"), CultureInfo.InvariantCulture)] = (
                double.Parse(reader.GetString("value_ohm"), CultureInfo.InvariantCulture),
                reader.GetString("status"),
                reader.GetString("taken_by"),
                reader.GetString("slot")
            );
        }

        Assert.Equal(LibraryExport.Columns, reader.Headers);
        // the undone part is not in the library
        Assert.Equal(parts.Where(p => p.Id != parts[3].Id).Select(p => p.Id), rows.Keys.Order());
        Assert.Equal((parts[0].Value, "Taken", "mira", "T1-B01"), rows[parts[0].Id]);
        Assert.Equal("Retired", rows[parts[2].Id].Status);
        Assert.All(parts.Skip(4), p => Assert.Equal((p.Value, "Available"), (rows[p.Id].Value, rows[p.Id].Status)));
    }

    // CSV injection: text cells starting with =, +, -, @ are neutralised with a leading apostrophe (OWASP "CSV
    // Injection" advice, from memory); negative numbers stay numbers; the database keeps the raw text.
    [Fact]
    public async Task Export_FormulaInLocationAndTaker_WrittenAsText_NumbersUntouched_RawKept()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        const string Hostile = "=HYPERLINK(\"http://example.invalid\",\"x\")";
        await using (var log = await store.OpenAsync())
        {
            await log.SetLocationAsync(parts[0].Id, Hostile, CancellationToken.None);
            await log.TakePartsAsync([parts[0].Id], "@mira", CancellationToken.None);
        }

        var file = store.File("library.csv");
        Assert.Equal(
            VerbExit.Ok,
            await LibraryExport.RunAsync(
                store.Database,
                file,
                null,
                null,
                new ConsoleCapture().Console,
                TextWriter.Null,
                CancellationToken.None
            )
        );

        using var reader = CsvReader.FromFile(file, null);
        var rows = new Dictionary<long, (string Location, string TakenBy, string Deviation)>();
        while (reader.Read())
        {
            rows[long.Parse(reader.GetString("id"), CultureInfo.InvariantCulture)] = (
                reader.GetString("location"),
                reader.GetString("taken_by"),
                reader.GetString("deviation_ppm")
            );
        }

        Assert.Equal(("'" + Hostile, "'@mira"), (rows[parts[0].Id].Location, rows[parts[0].Id].TakenBy));
        var negative = parts.First(p => p.DeviationPpm < 0);
        Assert.Equal(negative.DeviationPpm, double.Parse(rows[negative.Id].Deviation, CultureInfo.InvariantCulture));
        await using var check = await store.OpenAsync();
        Assert.Equal(Hostile, (await check.GetPartAsync(parts[0].Id, CancellationToken.None))!.Location);
    }

    [Fact]
    public async Task Take_UnknownIds_ExitsTwoNamingThemAndChangesNothing()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        var io = new ConsoleCapture();

        var code = await LibraryMoves.RunAsync(
            new MoveRequest(store.Database, LibraryMove.Take, [parts[0].Id, 404, 405], "mira"),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.BadInput, code);
        Assert.Contains("unknown part ids: 404, 405", io.Text, StringComparison.Ordinal);
        await using var log = await store.OpenAsync();
        Assert.Equal(
            LibraryStatus.Available,
            (await log.GetPartAsync(parts[0].Id, CancellationToken.None))!.LibraryStatus
        );
    }

    [Fact]
    public async Task Used_OnAvailableParts_IsRefused_ThenTakeUsedRetireWalkTheStatuses()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        long[] ids = [parts[0].Id, parts[1].Id];
        var io = new ConsoleCapture();

        Assert.Equal(
            VerbExit.Refused,
            await LibraryMoves.RunAsync(
                new MoveRequest(store.Database, LibraryMove.Use, ids, "dac-7"),
                io.Console,
                CancellationToken.None
            )
        );
        Assert.Contains($"{ids[0]} (Available)", io.Text, StringComparison.Ordinal);
        Assert.Equal(
            VerbExit.BadInput,
            await LibraryMoves.RunAsync(
                new MoveRequest(store.Database, LibraryMove.Retire, ids, null),
                io.Console,
                CancellationToken.None
            )
        );
        Assert.Equal(
            VerbExit.Ok,
            await LibraryMoves.RunAsync(
                new MoveRequest(store.Database, LibraryMove.Take, ids, "mira"),
                io.Console,
                CancellationToken.None
            )
        );
        Assert.Equal(
            VerbExit.Ok,
            await LibraryMoves.RunAsync(
                new MoveRequest(store.Database, LibraryMove.Use, ids, "dac-7"),
                io.Console,
                CancellationToken.None
            )
        );
        Assert.Equal(
            VerbExit.Ok,
            await LibraryMoves.RunAsync(
                new MoveRequest(store.Database, LibraryMove.Retire, [ids[0]], "drifted"),
                io.Console,
                CancellationToken.None
            )
        );

        await using var log = await store.OpenAsync();
        Assert.Equal(LibraryStatus.Retired, (await log.GetPartAsync(ids[0], CancellationToken.None))!.LibraryStatus);
        Assert.Equal(LibraryStatus.Used, (await log.GetPartAsync(ids[1], CancellationToken.None))!.LibraryStatus);
    }

    [Fact]
    public async Task LibraryCommand_ParsedFromArguments_LocatesAPartThatFindThenShows()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "reel", Parts);
        var io = new ConsoleCapture();
        var root = new System.CommandLine.RootCommand { LibraryCommand.Create(io.Console, io.Stdout) };

        var located = await root.Parse([
                "library",
                "locate",
                "--db",
                store.Database,
                "--id",
                $"{parts[4].Id}",
                "--at",
                "bag 7",
            ])
            .InvokeAsync();
        var found = await root.Parse(["library", "find", "--db", store.Database, "--location", "bag 7"]).InvokeAsync();
        var badIds = await root.Parse(["library", "labels", "--db", store.Database, "--ids", "3,x"]).InvokeAsync();

        Assert.Equal((0, 0, VerbExit.BadInput), (located, found, badIds));
        Assert.Equal([parts[4].Id], IdsListed(io.Text.Split("part(s).")[0].Split("-> 'bag 7'")[1]));
        Assert.Contains("--ids: 'x' is not a part id", io.Text, StringComparison.Ordinal);
    }

    // Rows of the find table start with the part id and show its nominal.
    private static List<long> IdsListed(string text) =>
        text.Split('\n')
            .Where(l => l.Contains("kOhm", StringComparison.Ordinal))
            .Select(l => l.TrimStart().Split(' ')[0])
            .Where(t => t.Length > 0 && t.All(char.IsAsciiDigit))
            .Select(t => long.Parse(t, CultureInfo.InvariantCulture))
            .ToList();
}
