using System.Diagnostics;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// Whole reels for every recipe: sets found, the proven upper bound, the gap and the time, with the default options
/// (10 s time limit). Nominals are drawn in proportion to one set's needs (a position allowing pairs shares its
/// weight with its pair nominal); deviations 'normal' or 'bimodal' as in <see cref="Reels"/>; expanded uncertainty
/// uniform 5–15 ppm (unequal, so the sweep's exact case does not apply).
/// </summary>
internal static class ReelBench
{
    public static List<string> Run(
        IReadOnlyList<(string File, Recipe Recipe)> recipes,
        int parts,
        TimeSpan limit,
        int seed,
        int window = 20,
        bool bimodal = true
    )
    {
        var rows = new List<string>
        {
            "| recipe | reel | parts | sets | upper bound | gap | bound method | search | time |",
            "|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var (file, recipe) in recipes)
        {
            foreach (
                var (shape, devs) in new (string, List<double>)[]
                {
                    ("normal", Reels.Normal(seed, parts)),
                    ("bimodal", Reels.Bimodal(seed, parts)),
                }.Take(bimodal ? 2 : 1)
            )
            {
                var list = Draw(recipe, devs, seed);
                var sw = Stopwatch.StartNew();
                var r = new SetAssembler(new AssemblyOptions(timeLimit: limit, neighbourhoodParts: window)).Assemble(
                    recipe,
                    list
                );
                sw.Stop();
                var bound =
                    r.BoundMethod.StartsWith("part-count", StringComparison.Ordinal) ? "part count"
                    : r.BoundMethod.StartsWith("column LP", StringComparison.Ordinal) ? "column LP"
                    : r.BoundMethod;
                rows.Add(
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"| {file} | {shape} | {parts:N0} | {r.Sets.Count} | {r.UpperBound} | {100 * r.Gap:0.00} % | "
                            + $"{bound} | {r.Method} | {sw.Elapsed.TotalSeconds:0.00} s |"
                    )
                );
                Console.WriteLine(rows[^1]);
                Console.WriteLine($"  ({r.Note})");
            }
        }

        return rows;
    }

    public static List<PartCandidate> Draw(Recipe recipe, List<double> devs, int seed)
    {
        var weights = new List<double>();
        foreach (var p in recipe.Positions)
        {
            var builds = new[] { p.Nominal }
                .Concat(p.Pairs.HasFlag(PairBuilds.Series) ? [p.Nominal / 2] : [])
                .Concat(p.Pairs.HasFlag(PairBuilds.Parallel) ? [p.Nominal * 2] : [])
                .ToArray();
            weights.AddRange(builds);
        }

        // Its own stream: the deviations were drawn from Random(seed), and the same stream here would tie nominal to
        // deviation.
        var rng = new Random(seed + 7919);
        return devs.Select(
                (d, i) => Reels.Part(i + 1, weights[rng.Next(weights.Count)], d, 5 + (10 * rng.NextDouble()))
            )
            .ToList();
    }
}
