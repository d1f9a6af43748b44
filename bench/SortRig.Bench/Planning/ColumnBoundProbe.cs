using System.Diagnostics;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// `planning colbound[:parts[:grid steps]]`: the column LP bound alone on reels of the matched recipes (up to 120 s
/// each, from the sweep's sets), beside the part-count bound; not written to docs.
/// </summary>
internal static class ColumnBoundProbe
{
    public static void Run(IReadOnlyList<(string File, Recipe Recipe)> recipes, int gridSteps, int size)
    {
        foreach (
            var (file, recipe) in recipes.Where(r =>
                r.Recipe.Form == RecipeForm.Matched
                && (Environment.GetEnvironmentVariable("COLONLY") is not { } only || r.File == only)
            )
        )
        {
            foreach (
                var (shape, devs) in new[] { ("normal", Reels.Normal(1, size)), ("bimodal", Reels.Bimodal(1, size)) }
            )
            {
                var parts = ReelBench.Draw(recipe, devs, 1);
                var options = new AssemblyOptions();
                var pool = new CandidatePool(recipe, parts, options, withPairs: false);
                var rule = new MatchedRule(recipe);
                var count = PartCountBound.Compute(recipe, pool.Usable, rule, options);
                var sw = Stopwatch.StartNew();
                var found = new SetAssembler(new AssemblyOptions(neighbourhoodParts: 0))
                    .Assemble(recipe, parts)
                    .Sets.Count;
                sw.Restart();
                var swept = new SweepPlanner(recipe, pool, rule, options).Run();
                var r = ColumnBoundStep.Run(
                    recipe,
                    pool.Usable,
                    options,
                    swept,
                    () => sw.Elapsed > TimeSpan.FromSeconds(120),
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
            }
        }
    }
}
