using System.Globalization;
using SortRig.Planning.Ordering;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Ordering;

/// <summary>`order` benchmark: order-estimate runtime (1 000 trials of 10 matched quads; every recipe in recipes/);
/// writes docs/bench-order.md.</summary>
internal static class OrderBenchmark
{
    public static async Task<int> RunAsync(string which, CancellationToken ct)
    {
        var root = FindRoot();
        var md = new List<string>
        {
            "# Order estimate benchmark (`dotnet run -c Release --project bench/SortRig.Bench -- order`)",
            "",
            FormattableString.Invariant($"Run of {DateTimeOffset.FromUnixTimeSeconds(TimeProvider.System.GetUtcNow().ToUnixTimeSeconds()):yyyy-MM-dd HH:mm} UTC on {Environment.ProcessorCount} cores shared with other builds (times include the pilot reel and both passes: smallest order per trial, then leftovers and the 8-point curve). Stock: our own invented demo reels; transfer uncertainty 20 ppm; seed 1; the trial assembler is the window sweep alone (`OrderOptions.FastAssembly`)."),
            "",
            "| recipe | stock | sets | trials | order 90 / 95 / 99 % (sets' worth) | parts at 95 % | not reached | time (s) |",
            "|---|---|---:|---:|---|---:|---:|---:|",
        };
        var quad = await RecipeLoader.LoadFileAsync(Path.Combine(root, "recipes", "matched-quad.yaml"), ct).ConfigureAwait(false);
        foreach (var stock in new[] { StockDistribution.Normal(0.01), StockDistribution.Uniform(0.01), StockDistribution.Bimodal(0.01) })
        {
            for (var run = 0; run < 3; run++)
            {
                md.Add(Row(quad, stock, 10, 1000));
            }
        }

        if (which != "quad")
        {
            foreach (var f in Directory.GetFiles(Path.Combine(root, "recipes"), "*.yaml").Order(StringComparer.Ordinal))
            {
                var recipe = await RecipeLoader.LoadFileAsync(f, ct).ConfigureAwait(false);
                md.Add(Row(recipe, StockDistribution.Normal(0.01), 10, 1000));
            }
        }

        md.Add("");
        md.Add("Each quad row is repeated three times to show the spread of the wall time on the shared machine; the figures (orders, reached) are identical by seed.");
        await File.WriteAllLinesAsync(Path.Combine(root, "docs", "bench-order.md"), md, ct).ConfigureAwait(false);
        foreach (var line in md)
        {
            Console.WriteLine(line);
        }

        return 0;
    }

    private static string Row(Recipe recipe, StockDistribution stock, int sets, int trials)
    {
        try
        {
            var e = new OrderEstimator().Estimate(recipe, new OrderOptions(sets, stock, trials: trials, seed: 1));
            var levels = string.Join(" / ", e.Levels.Select(l => l.SetEquivalents?.ToString(CultureInfo.InvariantCulture) ?? "beyond cap"));
            var parts95 = e.Levels[1].SetEquivalents is null ? "-" : e.Levels[1].TotalParts.ToString(CultureInfo.InvariantCulture);
            var row = FormattableString.Invariant($"| {recipe.Name} | {e.Stock} | {sets} | {trials} | {levels} | {parts95} | {e.NotReached} | {e.Elapsed.TotalSeconds:0.00} |");
            Console.WriteLine(row);
            return row;
        }
        catch (OrderRefusedException x)
        {
            return $"| {recipe.Name} | {stock.Describe()} | {sets} | {trials} | refused: {x.Message} | - | - | - |";
        }
    }

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(Environment.CurrentDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("run inside the repository");
    }
}
