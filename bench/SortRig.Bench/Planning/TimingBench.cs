using System.Diagnostics;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>Assembler wall time for 1 000, 10 000 and 100 000 parts (median of 3 runs after a warm-up).</summary>
internal static class TimingBench
{
    public static List<string> Run(IReadOnlyList<(string File, Recipe Recipe)> recipes)
    {
        var rows = new List<string> { "| recipe | parts | sets | method | median time |", "|---|---|---|---|---|" };
        foreach (var (file, recipe) in recipes)
        {
            var nominals = recipe
                .Positions.SelectMany(p =>
                    new[] { p.Nominal }
                        .Concat(p.Pairs.HasFlag(PairBuilds.Series) ? [p.Nominal / 2] : [])
                        .Concat(p.Pairs.HasFlag(PairBuilds.Parallel) ? [p.Nominal * 2] : [])
                )
                .Distinct()
                .ToArray();
            foreach (var n in new[] { 1_000, 10_000, 100_000 })
            {
                var rng = new Random(n);
                var parts = Enumerable
                    .Range(1, n)
                    .Select(i => Reels.Part(i, nominals[rng.Next(nominals.Length)], 3000 * Reels.Gauss(rng), 10))
                    .ToList();
                var assembler = new SetAssembler(new AssemblyOptions(neighbourhoodParts: 0));
                var result = assembler.Assemble(recipe, parts);
                var times = new List<double>();
                for (var run = 0; run < 3; run++)
                {
                    var sw = Stopwatch.StartNew();
                    assembler.Assemble(recipe, parts);
                    times.Add(sw.Elapsed.TotalMilliseconds);
                }

                rows.Add(
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"| {file} | {n:N0} | {result.Sets.Count} | {result.Method}"
                            + $"{(result.ProvenOptimal ? " (exact case)" : "")} | {times.Order().ElementAt(1):0} ms |"
                    )
                );
            }
        }

        return rows;
    }
}
