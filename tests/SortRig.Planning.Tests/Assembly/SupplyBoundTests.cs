using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The supply LP of the counting bound: the simplex against a textbook example, the bound against hand counts where the
/// Hall condition is loose, and never below the brute-force optimum on random instances with pairs.
/// </summary>
public sealed class SupplyBoundTests
{
    [Fact]
    public void Simplex_TextbookExample_ReachesItsOptimum()
    {
        // Chvátal, Linear Programming (1983), ch. 2 first example, from memory: max 5x1 + 4x2 + 3x3 subject to
        // 2x1 + 3x2 + x3 <= 5, 4x1 + x2 + 2x3 <= 11, 3x1 + 4x2 + 2x3 <= 8, x >= 0; optimum 13 at (2, 0, 1).
        var value = DenseSimplex.Maximize(
            [5, 4, 3],
            [
                [2, 3, 1],
                [4, 1, 2],
                [3, 4, 2],
            ],
            [5, 11, 8]
        );
        Assert.Equal(13, value, 9);
    }

    [Fact]
    public void Simplex_UnboundedProgramme_ReportsInfinity()
    {
        // Textbook identity: max x1 subject to x1 - x2 <= 1 has no finite optimum (x2 free to grow).
        Assert.Equal(
            double.PositiveInfinity,
            DenseSimplex.Maximize(
                [1, 0],
                [
                    [1, -1],
                ],
                [1]
            )
        );
    }

    [Fact]
    public void PairsTakeTwoParts_BoundIsTheSupplyNotTheHallCount()
    {
        // A 10k single and a 20k made of two 10k in series, from six 10k parts close together: each set takes
        // three parts, so at most 2 sets (hand count, common practice, no source). The Hall count gives ⌊6 / 2⌋ = 3.
        var recipe = RandomInstances.Matched(4);
        var parts = Enumerable.Range(0, 6).Select(i => Part(i, 10e3, 10e3 * (1 + (i * 1e-5)))).ToList();
        var usable = new CandidatePool(recipe, parts, new AssemblyOptions(), withPairs: false).Usable;
        Assert.Equal(2, PartCountBound.Compute(recipe, usable, new MatchedRule(recipe), new AssemblyOptions()));
        var exact = new SetAssembler().Assemble(recipe, parts);
        Assert.Equal(2, exact.Sets.Count);
    }

    [Fact]
    public void LadderShape_TenKPartsSplitBetweenRungsAndLegs()
    {
        // 7 rungs of 10k and 9 legs of 20k (single 20k or two 10k in series), as the R-2R recipe: with 640 10k
        // and 360 20k parts, N sets need 7N + 2(9N − 360) ≤ 640, so N ≤ 54 (hand count); the Hall count gives
        // ⌊1000/16⌋ = 62.
        var text = File.ReadAllText(RepoPaths.Recipe("r2r-dac-8bit.yaml"));
        var recipe = RecipeLoader.Load(text, "r2r-dac-8bit.yaml");
        var parts = Enumerable.Range(0, 1000).Select(i => i < 640 ? Part(i, 10e3, 10e3) : Part(i, 20e3, 20e3)).ToList();
        var usable = new CandidatePool(recipe, parts, new AssemblyOptions(), withPairs: false).Usable;
        Assert.Equal(54, PartCountBound.Compute(recipe, usable, new NetworkRule(recipe), new AssemblyOptions()));
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 40));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void ReelScaleBound_NeverBelowBruteForceOptimum_WithPairs(int seed)
    {
        // Shapes with pair builds (3, 4, 5), nominals skewed toward the pair nominal so the supply LP binds.
        var rng = new Random(77_000 + seed);
        var shape = 3 + (seed % 3);
        var recipe = RandomInstances.Matched(shape);
        double[] nominals = shape switch
        {
            3 => [10e3, 20e3, 20e3],
            4 => [10e3, 10e3, 10e3, 20e3],
            _ => [10e3, 10e3, 20e3, 20e3, 5e3],
        };
        var parts = RandomInstances.Parts(rng, rng.Next(6, 9), nominals, sigma: 500e-6, maxRelU: 100e-6);
        var (optimum, _) = BruteForce.Solve(recipe, parts, BruteForce.Matched(recipe));
        var search = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts);
        Assert.True(search.UpperBound >= optimum, $"seed {seed}: bound {search.UpperBound} < optimum {optimum}");
        Assert.True(search.Sets.Count <= optimum, $"seed {seed}: {search.Sets.Count} sets > optimum {optimum}");
        AssemblerRefereeTests.AssertSetsValid(recipe, parts, search, BruteForce.Matched(recipe));
    }

    private static PartCandidate Part(int i, double nominal, double value) =>
        new(i + 1, nominal, new MeasuredValue(value, value * 5e-6, value * 2.5e-6), null);
}
