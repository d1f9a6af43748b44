using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Host.OrderVerb;
using SortRig.Host.Tests.Library;
using SortRig.Host.Tests.Planning;
using SortRig.Host.VerbSupport;
using SortRig.Tests.Support;

namespace SortRig.Host.Tests.OrderVerb;

/// <summary>The order and reach verbs on real SQLite stores, run in-process.</summary>
public sealed partial class OrderVerbTests
{
    // Fourteen 10 kOhm parts, transfer u 10 ppm (U = 20 ppm): invented values, spread so quads compete.
    private static readonly SeedPart[] s_parts = new double[]
    {
        -1800,
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
        .Select(ppm => new SeedPart(ppm, 10))
        .ToArray();

    [Fact]
    public async Task Reach_ReportedMatch_AgreesWithABruteForceOptimum()
    {
        // Referee: the independent brute force of the plan verb's tests (every subset, every packing, the matched rule
        // of docs/planning.md). The optimum can only grow with the tolerance, so it must make 2 quads just above the
        // reported match and fewer just below the tighter end of the bracket.
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        var parts = await Seed.SessionAsync(store, "drawer", s_parts);
        var io = new ConsoleCapture();
        var code = await ReachRunner.RunAsync(
            new ReachRequest(store.Database, "drawer", PlanVerbTests.Recipe, 2),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        var m = MatchLine().Match(io.Text);
        Assert.True(m.Success, io.Text);
        var reported = double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture);
        var tighter = double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
        var values = parts.Select(p => (p.Value, p.Measured.ExpandedTransfer)).ToList();
        Assert.True(MatchedBruteForce.MaxDisjoint(values, 4, 10_000, reported + 2) >= 2, io.Text);
        Assert.True(MatchedBruteForce.MaxDisjoint(values, 4, 10_000, tighter - 2) < 2, io.Text);
        Assert.True(reported < 1000, "the drawer should do better than the recipe's 1000 ppm for two sets");
    }

    [Fact]
    public async Task Order_FromSession_WritesThreeLevelsTheCurveAndAPng()
    {
        await using var store = await TestStore.CreateAsync(StoreEngine.Sqlite);
        await Seed.SessionAsync(store, "drawer", s_parts);
        var (csv, curve, png) = (store.File("order.csv"), store.File("curve.csv"), store.File("order.png"));
        var io = new ConsoleCapture();
        var code = await OrderRunner.RunAsync(
            new OrderRequest(
                PlanVerbTests.Recipe,
                5,
                Database: store.Database,
                FromSession: "drawer",
                Trials: 200,
                Price: "1:0.10,100:0.04",
                CsvPath: csv,
                CurveCsvPath: curve,
                PlotPath: png
            ),
            io.Console,
            CancellationToken.None
        );

        Assert.Equal(VerbExit.Ok, code);
        Assert.Contains("session 'drawer'", io.Text, StringComparison.Ordinal);
        var rows = File.ReadAllLines(csv).Skip(1).Select(l => l.Split(',')).ToList();
        Assert.Equal(["0.9", "0.95", "0.99"], rows.Select(r => r[0]));
        var quantities = rows.Select(r => int.Parse(r[3], CultureInfo.InvariantCulture)).ToList();
        Assert.Equal(quantities.Order(), quantities);
        Assert.All(quantities, q => Assert.True(q >= 20 && q % 4 == 0, $"{q} parts for 5 quads"));

        // Quantity-break arithmetic (common practice, no source): q parts at 0.10 each below 100.
        Assert.All(rows, r =>
            Assert.Equal(
                int.Parse(r[3], CultureInfo.InvariantCulture) * 0.10,
                double.Parse(r[5], CultureInfo.InvariantCulture),
                9
            )
        );
        Assert.True(File.ReadAllLines(curve).Length >= 3);
        // PNG signature (PNG spec, ISO/IEC 15948 sec. 5.2)
        Assert.Equal([0x89, 0x50, 0x4E, 0x47], (await File.ReadAllBytesAsync(png)).Take(4));
    }

    [Fact]
    public async Task Order_BadInput_OneLineExit2_AndNoDatabaseCreated()
    {
        var folder = Directory.CreateTempSubdirectory("sortrig-order-").FullName;
        var missing = Path.Combine(folder, "none.db");
        var cases = new (OrderRequest Request, string Expected)[]
        {
            (new OrderRequest(PlanVerbTests.Recipe, 0), "--sets:"),
            (new OrderRequest(PlanVerbTests.Recipe, 3, Uncertainty: 900e-6), "tighter than the meter"),
            (new OrderRequest(PlanVerbTests.Recipe, 3, Stock: "lumpy"), "--stock:"),
            (new OrderRequest(PlanVerbTests.Recipe, 3, Database: missing, FromSession: "x"), "--db:"),
            (new OrderRequest(PlanVerbTests.Recipe, 3, Price: "1:abc"), "--price:"),
        };
        foreach (var (request, expected) in cases)
        {
            var io = new ConsoleCapture();
            Assert.Equal(VerbExit.BadInput, await OrderRunner.RunAsync(request, io.Console, CancellationToken.None));
            Assert.Contains(expected, io.Text, StringComparison.Ordinal);
            Assert.Single(io.Text.Trim().Split('\n'));
            Assert.DoesNotContain("   at ", io.Text, StringComparison.Ordinal);
        }

        Assert.False(File.Exists(missing));
    }

    [GeneratedRegex(@"match ([0-9.]+) ppm \(recipe [0-9.]+ ppm; at ([0-9.]+) ppm only")]
    private static partial Regex MatchLine();
}
