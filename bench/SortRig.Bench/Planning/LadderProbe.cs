using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// `planning ladder`: the R-2R reels (seed 1) split by the sign of each part's deviation, each half assembled alone;
/// then the whole bimodal reel on seeds 2-6, a check that the split at the widest gap is not one seed's. Not written.
/// </summary>
internal static class LadderProbe
{
    public static void Run(Recipe recipe)
    {
        foreach (var (shape, devs) in new[] { ("normal", Reels.Normal(1, 1000)), ("bimodal", Reels.Bimodal(1, 1000)) })
        {
            var parts = ReelBench.Draw(recipe, devs, 1);
            var options = new AssemblyOptions();
            var rule = new NetworkRule(recipe);
            var whole = new SetAssembler().Assemble(recipe, parts);
            Console.WriteLine($"{shape}: whole {whole.Sets.Count} / {whole.UpperBound} ({whole.BoundMethod})");
            foreach (
                var (label, half) in new[]
                {
                    ("low", parts.Where(p => p.Value.Value < p.Nominal).ToList()),
                    ("high", parts.Where(p => p.Value.Value >= p.Nominal).ToList()),
                }
            )
            {
                var pool = new CandidatePool(recipe, half, options, withPairs: false);
                var count = PartCountBound.Compute(recipe, pool.Usable, rule, options);
                var r = new SetAssembler().Assemble(recipe, half);
                var byNominal = string.Join(
                    ", ",
                    half.GroupBy(p => p.Nominal).OrderBy(g => g.Key).Select(g => $"{g.Key}: {g.Count()}")
                );
                Console.WriteLine(
                    $"  {label}: {half.Count} parts ({byNominal}), part count {count}, search {r.Sets.Count} / "
                        + $"{r.UpperBound}, {r.Method}"
                );
            }
        }

        foreach (var seed in Enumerable.Range(2, 5))
        {
            var parts = ReelBench.Draw(recipe, Reels.Bimodal(seed, 1000), seed);
            var r = new SetAssembler().Assemble(recipe, parts);
            var modes = new[]
            {
                parts.Where(p => p.Value.Value < p.Nominal),
                parts.Where(p => p.Value.Value >= p.Nominal),
            }
                .Select(h =>
                    PartCountBound.Compute(
                        recipe,
                        new CandidatePool(recipe, h.ToList(), new AssemblyOptions(), withPairs: false).Usable,
                        new NetworkRule(recipe),
                        new AssemblyOptions()
                    )
                )
                .ToArray();
            Console.WriteLine(
                $"bimodal seed {seed}: {r.Sets.Count} / {r.UpperBound}, {r.Elapsed.TotalSeconds:0.00} s; each mode's "
                    + $"own part count {modes[0]} + {modes[1]} = {modes.Sum()}: {r.Note}"
            );
        }
    }
}
