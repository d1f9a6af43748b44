using System.Diagnostics;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// `planning colbound[:parts[:grid steps]]`: the column LP bound alone on reels of the matched recipes and of the
/// network recipes of at most <see cref="ColumnBoundStep.MaxNetworkPositions"/> positions or with two
/// scale-invariant position pairs (<see cref="RatioPairPricing"/>) (up to 120 s each, or
/// COLSECONDS; COLONLY=name for one recipe; from the sweep's sets), beside the part-count bound; not written to docs.
/// </summary>
internal static class ColumnBoundProbe
{
    private static readonly double s_limit = double.Parse(
        Environment.GetEnvironmentVariable("COLSECONDS") ?? "120",
        System.Globalization.CultureInfo.InvariantCulture
    );

    public static void Run(IReadOnlyList<(string File, Recipe Recipe)> recipes, int gridSteps, int size)
    {
        foreach (
            var (file, recipe) in recipes.Where(r =>
                (
                    r.Recipe.Form == RecipeForm.Matched
                    || r.Recipe.Positions.Count <= ColumnBoundStep.MaxNetworkPositions
                    || RatioPairPricing.Applies(r.Recipe)
                ) && (Environment.GetEnvironmentVariable("COLONLY") is not { } only || r.File == only)
            )
        )
        {
            foreach (
                var (shape, devs) in new[] { ("normal", Reels.Normal(1, size)), ("bimodal", Reels.Bimodal(1, size)) }
            )
            {
                var parts = ReelBench.Draw(recipe, devs, 1);
                if (Environment.GetEnvironmentVariable("COLLEFT") is not null)
                {
                    Leftovers(file, shape, recipe, parts);
                    continue;
                }

                var options = new AssemblyOptions();
                var pool = new CandidatePool(recipe, parts, options, withPairs: false);
                ISetRule rule = recipe.Form == RecipeForm.Matched ? new MatchedRule(recipe) : new NetworkRule(recipe);
                var count = PartCountBound.Compute(recipe, pool.Usable, rule, options);
                var sw = Stopwatch.StartNew();
                var found = new SetAssembler(new AssemblyOptions(neighbourhoodParts: 0))
                    .Assemble(recipe, parts)
                    .Sets.Count;
                sw.Restart();
                var swept = new SweepPlanner(recipe, pool, rule, options).Run();
                if (recipe.Form == RecipeForm.Network)
                {
                    var leaves = RatioPairPricing.Applies(recipe)
                        ? RatioPairPricing.TryCreate(recipe, pool.Usable, options, () => false)?.Leaves
                        : NetworkPricing.TryCreate(recipe, pool.Usable, options, () => false)?.Leaves;
                    Console.WriteLine(
                        $"{file} {shape}: pricing built in {sw.Elapsed.TotalSeconds:0.00} s, {leaves} leaves"
                    );
                    sw.Restart();
                }

                if (Environment.GetEnvironmentVariable("COLTRACE") is not null && recipe.Form == RecipeForm.Network)
                {
                    IColumnPricing? p = RatioPairPricing.Applies(recipe)
                        ? RatioPairPricing.TryCreate(recipe, pool.Usable, options, () => false)
                        : NetworkPricing.TryCreate(recipe, pool.Usable, options, () => false);
                    var initial = swept.Select(s =>
                        s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray()
                    );
                    ColumnTrace.Run(
                        p!,
                        pool.Usable.Count,
                        initial,
                        () => sw.Elapsed > TimeSpan.FromSeconds(s_limit),
                        int.Parse(
                            Environment.GetEnvironmentVariable("COLPER") ?? "600",
                            System.Globalization.CultureInfo.InvariantCulture
                        )
                    );
                    continue;
                }

                if (Environment.GetEnvironmentVariable("COLBINS") is { } bins && RatioPairPricing.Applies(recipe))
                {
                    var rp = RatioPairPricing.TryCreate(recipe, pool.Usable, options, () => false)!;
                    var b = BinnedColumnBound.Solve(
                        rp,
                        pool.Usable,
                        swept.Select(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray()),
                        () => sw.Elapsed > TimeSpan.FromSeconds(s_limit),
                        binsPerNominal: int.Parse(bins, System.Globalization.CultureInfo.InvariantCulture)
                    );
                    Console.WriteLine(
                        string.Create(
                            System.Globalization.CultureInfo.InvariantCulture,
                            $"  {bins} bins: {b?.Value:0.000} → {b?.Bound}, {b?.Rounds} rounds, converged "
                                + $"{b?.Converged}, "
                                + $"{sw.Elapsed.TotalSeconds:0.00} s"
                        )
                    );
                    continue;
                }

                var r = ColumnBoundStep.Run(
                    recipe,
                    pool.Usable,
                    options,
                    swept,
                    () => sw.Elapsed > TimeSpan.FromSeconds(s_limit),
                    gridSteps
                );
                Console.WriteLine(
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"{file} {shape} {size} parts: sweep {found}, part count {count}, column LP {r?.Value:0.000} "
                            + $"→ {r?.Bound} "
                            + $"(m = {r?.MinSetCost:0.000000}, {r?.Rounds} rounds, {r?.Columns} columns, "
                            + $"converged {r?.Converged}) in {sw.Elapsed.TotalSeconds:0.00} s, grid 1/{gridSteps}"
                    )
                );
                if (r is not null)
                {
                    var tightPool = r.Pool.Where(c => c.Sum(i => r.Duals[i]) / r.MinSetCost <= 1 + 1e-6).ToList();
                    var t0 = Stopwatch.StartNew();
                    var (packed, how) = SortRig.Planning.Assembly.Packing.PoolPacker.Improve(
                        recipe,
                        pool.Usable,
                        rule,
                        options,
                        r,
                        swept,
                        () => t0.Elapsed > TimeSpan.FromSeconds(30)
                    );
                    Console.WriteLine(
                        $"  pool packing: {packed.Count} sets from {r.Pool.Count} columns (sweep {swept.Count}), "
                            + $"{how} in {t0.Elapsed.TotalSeconds:0.00} s"
                    );
                    PoolCpSat.Report(r, tightPool, pool.Usable.Count);
                }
            }
        }
    }

    // COLLEFT=1: where the search leaves its unused parts (deviation in 0.1 % buckets per nominal), and how many sets
    // a second search over the unused parts alone still finds (sets the first left in the cups).
    private static void Leftovers(string file, string shape, Recipe recipe, List<PartCandidate> parts)
    {
        var first = new SetAssembler().Assemble(recipe, parts);
        var second = new SetAssembler().Assemble(recipe, first.Unused);
        Console.WriteLine(
            $"{file} {shape}: {first.Sets.Count} sets, {first.Unused.Count} unused; on the unused alone "
                + $"{second.Sets.Count} more sets (bound {second.UpperBound})"
        );
        foreach (var g in first.Unused.GroupBy(p => p.Nominal).OrderBy(g => g.Key))
        {
            var buckets = g.GroupBy(p => (int)Math.Floor(((p.Value.Value / p.Nominal) - 1) * 1000))
                .OrderBy(b => b.Key)
                .Select(b =>
                    string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{b.Key / 10.0:0.0}%:{b.Count()}")
                );
            var all = parts.Where(p => p.Nominal == g.Key).ToList();
            Console.WriteLine(
                $"  {g.Key} Ω: {g.Count()} unused of {all.Count} (low mode "
                    + $"{all.Count(p => p.Value.Value < p.Nominal)}, "
                    + $"high {all.Count(p => p.Value.Value >= p.Nominal)}): {string.Join(' ', buckets)}"
            );
        }
    }
}
