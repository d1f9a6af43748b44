using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The partner-matching bound: Glover's greedy against an augmenting-path maximum matching (textbook: Kuhn's Hungarian
/// augmenting paths, Berge's theorem) on random convex graphs; the bound against the exact optimum on small networks.
/// </summary>
public sealed class PartnerMatchingBoundTests
{
    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 40));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void ConvexMatching_EqualsAugmentingPathMatching(int seed)
    {
        var rng = new Random(31_000 + seed);
        var points = Enumerable.Range(0, rng.Next(1, 14)).Select(_ => Math.Round(rng.NextDouble() * 20)).Order().ToArray();
        var intervals = Enumerable.Range(0, rng.Next(1, 14)).Select(_ =>
        {
            var lo = Math.Round(rng.NextDouble() * 20);
            return (lo, lo + Math.Round(rng.NextDouble() * 6));
        }).ToList();
        Assert.Equal(AugmentingPaths(intervals, points), PartnerMatchingBound.ConvexMatching(intervals, points));
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void DiffAmp_BoundNeverBelowExactOptimum(int seed)
    {
        // Gain-10 difference amplifier, 16 parts of 1k and 10k spread wide against its 500 ppm gain spec.
        var recipe = RecipeLoader.Load(File.ReadAllText(RepoPaths.Recipe("diff-amp-g10.yaml")), "diff-amp-g10.yaml");
        var rng = new Random(32_000 + seed);
        var parts = RandomInstances.Parts(rng, 16, [1e3, 10e3], sigma: 1500e-6, maxRelU: 20e-6);
        var exact = new SetAssembler().Assemble(recipe, parts);
        Assert.Equal(AssemblyMethod.Exact, exact.Method);
        var options = new AssemblyOptions();
        var usable = new CandidatePool(recipe, parts, options, withPairs: false).Usable;
        var bound = PartCountBound.Compute(recipe, usable, new NetworkRule(recipe), options);
        Assert.True(bound >= exact.Sets.Count, $"seed {seed}: bound {bound} < optimum {exact.Sets.Count}");
    }

    private static int AugmentingPaths(List<(double Lo, double Hi)> intervals, double[] points)
    {
        var owner = Enumerable.Repeat(-1, points.Length).ToArray();
        var count = 0;
        for (var i = 0; i < intervals.Count; i++)
        {
            if (Augment(i, new bool[points.Length]))
            {
                count++;
            }
        }

        return count;

        bool Augment(int i, bool[] seen)
        {
            for (var p = 0; p < points.Length; p++)
            {
                if (seen[p] || points[p] < intervals[i].Lo || points[p] > intervals[i].Hi)
                {
                    continue;
                }

                seen[p] = true;
                if (owner[p] < 0 || Augment(owner[p], seen))
                {
                    owner[p] = i;
                    return true;
                }
            }

            return false;
        }
    }
}
