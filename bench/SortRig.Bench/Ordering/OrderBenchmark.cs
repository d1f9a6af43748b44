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
        var now = DateTimeOffset.FromUnixTimeSeconds(TimeProvider.System.GetUtcNow().ToUnixTimeSeconds());
        var md = new List<string>
        {
            "# Order estimate benchmark (`dotnet run -c Release --project bench/SortRig.Bench -- order`)",
            "",
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"Run of {now:yyyy-MM-dd HH:mm} UTC on {Environment.ProcessorCount} cores shared with other builds "
                    + $"(times include the pilot reel and both passes: smallest order per trial, then leftovers and "
                    + $"the 8-point curve). Stock: our own invented demo reels; transfer uncertainty 20 ppm; seed "
                    + $"1; the trial assembler is the window sweep alone (`OrderOptions.FastAssembly`)."
            ),
            "",
            "| recipe | stock | sets | trials | order 90 / 95 / 99 % (sets' worth) | parts at 95 % | not reached | "
                + "time (s) |",
            "|---|---|---:|---:|---|---:|---:|---:|",
        };
        var quad = await RecipeLoader
            .LoadFileAsync(Path.Combine(root, "recipes", "matched-quad.yaml"), ct)
            .ConfigureAwait(false);
        foreach (
            var stock in new[]
            {
                StockDistribution.Normal(0.01),
                StockDistribution.Uniform(0.01),
                StockDistribution.Bimodal(0.01),
            }
        )
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

        if (which != "quad")
        {
            var divider = await RecipeLoader
                .LoadFileAsync(Path.Combine(root, "recipes", "decade-divider.yaml"), ct)
                .ConfigureAwait(false);
            md.Add("");
            md.Add(
                "Variants on the decade divider (10 sets, normal ±1 %): per-nominal trim (`--per-nominal`), and the "
                    + "full search with a 0.05 s limit per assembler run (`--time-limit 0.05`, not repeatable; fewer "
                    + "trials)."
            );
            md.Add("");
            md.Add(
                "| variant | trials | parts at 90 / 95 / 99 % | per nominal at 95 % | mean smallest order (sets' "
                    + "worth) | time (s) |"
            );
            md.Add("|---|---:|---|---|---:|---:|");
            md.Add(
                Variant(
                    "joint (default)",
                    divider,
                    new OrderOptions(10, StockDistribution.Normal(0.01), trials: 1000, seed: 1)
                )
            );
            md.Add(
                Variant(
                    "per-nominal trim",
                    divider,
                    new OrderOptions(10, StockDistribution.Normal(0.01), trials: 1000, seed: 1, perNominal: true)
                )
            );
            md.Add(
                Variant(
                    "joint, sweep only",
                    divider,
                    new OrderOptions(10, StockDistribution.Normal(0.01), trials: 100, seed: 1)
                )
            );
            md.Add(
                Variant(
                    "joint, full search 0.05 s",
                    divider,
                    new OrderOptions(
                        10,
                        StockDistribution.Normal(0.01),
                        trials: 100,
                        seed: 1,
                        assembly: new SortRig.Planning.Assembly.AssemblyOptions(timeLimit: TimeSpan.FromSeconds(0.05))
                    )
                )
            );
            md.Add("");
            md.Add(
                "Reach (`reach`) on a seeded 1 000-part reel per recipe (normal ±1 %, 20 ppm, nominals in per-set "
                    + "proportion), for half the sets the recipe as written makes:"
            );
            md.Add("");
            md.Add(
                "| recipe | parts | sets as written | sets wanted | tightest scale (match ppm) | assembler runs | "
                    + "extra-part bands | time (s) |"
            );
            md.Add("|---|---:|---:|---:|---|---:|---:|---:|");
            foreach (var f in Directory.GetFiles(Path.Combine(root, "recipes"), "*.yaml").Order(StringComparer.Ordinal))
            {
                md.Add(ReachRow(await RecipeLoader.LoadFileAsync(f, ct).ConfigureAwait(false)));
            }
        }

        md.Add("");
        md.Add(
            "Each quad row is repeated three times to show the spread of the wall time on the shared machine; the "
                + "figures (orders, reached) are identical by seed."
        );
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
            var levels = string.Join(
                " / ",
                e.Levels.Select(l => l.SetEquivalents?.ToString(CultureInfo.InvariantCulture) ?? "beyond cap")
            );
            var parts95 = e.Levels[1].SetEquivalents is null
                ? "-"
                : e.Levels[1].TotalParts.ToString(CultureInfo.InvariantCulture);
            var row = string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"| {recipe.Name} | {e.Stock} | {sets} | {trials} | {levels} | {parts95} | {e.NotReached} | "
                    + $"{e.Elapsed.TotalSeconds:0.00} |"
            );
            Console.WriteLine(row);
            return row;
        }
        catch (OrderRefusedException x)
        {
            return $"| {recipe.Name} | {stock.Describe()} | {sets} | {trials} | refused: {x.Message} | - | - | - |";
        }
    }

    private static string Variant(string name, Recipe recipe, OrderOptions options)
    {
        var e = new OrderEstimator().Estimate(recipe, options);
        var parts = string.Join(" / ", e.Levels.Select(l => l.TotalParts.ToString(CultureInfo.InvariantCulture)));
        var per = string.Join(
            ", ",
            e.Levels[1].Lines.Select(l => FormattableString.Invariant($"{l.Nominal:0} Ω × {l.Quantity}"))
        );
        var row = FormattableString.Invariant(
            $"| {name} | {e.Trials} | {parts} | {per} | {e.MeanSetEquivalents:0.0} | {e.Elapsed.TotalSeconds:0.0} |"
        );
        Console.WriteLine(row);
        return row;
    }

    private static string ReachRow(Recipe recipe)
    {
        var classes = recipe.SinglePartDemand.OrderBy(kv => kv.Key).ToArray();
        var perSet = classes.Sum(c => c.Value);
        var rng = new MathNet.Numerics.Random.Xoshiro256StarStar(7, threadSafe: false);
        var parts = new List<SortRig.Planning.Assembly.PartCandidate>();
        var stock = StockDistribution.Normal(0.01);
        foreach (var (nominal, count) in classes)
        {
            for (var i = 0; i < 1000 * count / perSet; i++)
            {
                var v = nominal * (1 + stock.Draw(rng));
                parts.Add(
                    new SortRig.Planning.Assembly.PartCandidate(
                        parts.Count,
                        nominal,
                        new SortRig.Measurement.Uncertainty.MeasuredValue(v, v * 10e-6, v * 10e-6),
                        null
                    )
                );
            }
        }

        var started = TimeProvider.System.GetTimestamp();
        var written = new SortRig.Planning.Assembly.SetAssembler(OrderOptions.FastAssembly)
            .Assemble(recipe, parts)
            .Sets.Count;
        var wanted = Math.Max(1, written / 2);
        try
        {
            var r = new SortRig.Planning.Reach.OnHandReach().Find(recipe, parts, wanted);
            var scale = r.MatchPpm is { } m
                ? FormattableString.Invariant($"{r.Scale:0.###} ({m:0.#} ppm)")
                : FormattableString.Invariant($"{r.Scale:0.###}");
            var row = string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"| {recipe.Name} | {parts.Count} | {written} | {wanted} | {scale} | {r.Assemblies} | "
                    + $"{r.ExtraParts.Count} | {TimeProvider.System.GetElapsedTime(started).TotalSeconds:0.0} |"
            );
            Console.WriteLine(row);
            return row;
        }
        catch (OrderRefusedException x)
        {
            return $"| {recipe.Name} | {parts.Count} | {written} | {wanted} | refused: {x.Message} | - | - | - |";
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
