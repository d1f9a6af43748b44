using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The network-form part filter of the counting bound must be a relaxation: it never drops a part that an optimal
/// plan uses, and the bound stays at or above the optimum. Referees: the independent brute force
/// (<see cref="BruteForce"/>) and the exact search (itself refereed against the brute force and CP-SAT).
/// </summary>
public sealed class NetworkPartFilterTests
{
    private static readonly Recipe s_decade = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("decade-divider.yaml")),
        "decade-divider.yaml"
    );

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 30));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void DecadeDivider_PartsOfTheExactOptimum_AreNeverExcluded_BoundAtLeastOptimum(int seed)
    {
        // Wide spread (σ 0.4 %) against 200/400 ppm specs, so the tails have parts that fit no set.
        var rng = new Random(90_000 + seed);
        var parts = RandomInstances.Parts(rng, 15, [90e3, 9e3, 1e3, 2e3], sigma: 4000e-6, maxRelU: 30e-6);
        var exact = new SetAssembler().Assemble(s_decade, parts);
        Assert.Equal(AssemblyMethod.Exact, exact.Method);
        AssertRelaxation(s_decade, parts, exact, $"seed {seed}");
    }

    [Theory]
    [MemberData(nameof(Seeds))]
    public void TwoLegDivider_BoundAtLeastBruteForceOptimum(int seed)
    {
        var rng = new Random(91_000 + seed);
        var recipe = RandomInstances.Divider(seriesTop: seed % 2 == 0, tolPpm: 300);
        var parts = RandomInstances.Parts(rng, 8, seed % 2 == 0 ? [10e3, 5e3] : [10e3], sigma: 3000e-6, maxRelU: 60e-6);
        var (optimum, _) = BruteForce.Solve(recipe, parts, BruteForce.Divider(recipe, 300));
        var exact = new SetAssembler().Assemble(recipe, parts);
        Assert.Equal(optimum, exact.Sets.Count);
        AssertRelaxation(recipe, parts, exact, $"seed {seed}");
    }

    [Fact]
    public void PartFarOffTheReel_IsNotCounted()
    {
        // Two equal legs, ratio 1/2 within 300 ppm: ratio R2/(R1+R2) moves by about half the legs' relative mismatch
        // (textbook derivative of x/(1+x) at x = 1 is 1/4, i.e. 1/2 in relative terms), so a part 2 % off pairs with no
        // part within 0.2 % of nominal. 5 close parts and 1 far: the count was ⌊6/2⌋ = 3, the optimum is ⌊5/2⌋ = 2.
        var recipe = RandomInstances.Divider(seriesTop: false, tolPpm: 300);
        var parts = Enumerable
            .Range(0, 5)
            .Select(i => Part(i, 10e3 * (1 + (i * 1e-4))))
            .Append(Part(5, 10e3 * 1.02))
            .ToList();
        var usable = new CandidatePool(recipe, parts, new AssemblyOptions(), withPairs: false).Usable;
        Assert.Equal(2, PartCountBound.Compute(recipe, usable, new NetworkRule(recipe), new AssemblyOptions()));
        var search = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts);
        Assert.Equal(2, search.UpperBound);
        Assert.True(search.ProvenOptimal);
    }

    private static PartCandidate Part(int i, double value) =>
        new(i + 1, 10e3, new MeasuredValue(value, value * 5e-6, value * 2.5e-6), null);

    private static void AssertRelaxation(Recipe recipe, List<PartCandidate> parts, AssemblyResult exact, string label)
    {
        var options = new AssemblyOptions();
        var usable = new CandidatePool(recipe, parts, options, withPairs: false).Usable;
        var rule = new NetworkRule(recipe);
        var geo = new SweepGeometry(recipe, rule);
        var filter = NetworkPartFilter.TryCreate(recipe, rule, geo, usable, options);
        Assert.NotNull(filter);
        foreach (var fill in exact.Sets.SelectMany(s => s.Fills).Where(f => f.Build == PositionBuild.Single))
        {
            var position = recipe.Positions.First(p => p.Name == fill.Position);
            var cls = Array.IndexOf(geo.Nominals, position.Nominal);
            var index = usable.FindIndex(p => p.Id == fill.Parts[0].Id);
            Assert.True(filter.Fits(cls, index), $"{label}: part {fill.Parts[0].Id} of an optimal set was excluded");
        }

        var bound = PartCountBound.Compute(recipe, usable, rule, options);
        Assert.True(bound >= exact.Sets.Count, $"{label}: bound {bound} < optimum {exact.Sets.Count}");
    }
}
