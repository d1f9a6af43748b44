using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// `planning ratio-seeds`: the ratio set's 1 000-part reels on seeds 2-4 (the benchmark's tables use seed 1), a check
/// that the pair release is not one seed's. Not written.
/// </summary>
internal static class RatioSeedsProbe
{
    public static void Run(Recipe recipe)
    {
        foreach (var seed in Enumerable.Range(2, 3))
        {
            foreach (
                var (shape, devs) in new[]
                {
                    ("normal", Reels.Normal(seed, 1000)),
                    ("bimodal", Reels.Bimodal(seed, 1000)),
                }
            )
            {
                var r = new SetAssembler().Assemble(recipe, ReelBench.Draw(recipe, devs, seed));
                Console.WriteLine(
                    $"ratio-set {shape} seed {seed}: {r.Sets.Count} / {r.UpperBound} ({r.BoundMethod[..10]}), "
                        + $"{r.Elapsed.TotalSeconds:0.00} s: {r.Note[Math.Max(0, r.Note.Length - 60)..]}"
                );
            }
        }
    }
}
