using FsCheck;
using FsCheck.Fluent;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The reel-scale path (exact search off: sweep, then neighbourhood search) against the independent brute force
/// (<see cref="BruteForce"/>, every partition of the parts; textbook set partitioning by restricted-growth strings),
/// and the proven upper bound against the true optimum. Windows are the smallest that can hold two sets, so the
/// search cannot simply solve the whole instance.
/// </summary>
public sealed class NeighbourhoodSearchTests
{
    public static TheoryData<int> Blocks => new(Enumerable.Range(0, 6));

    [Theory]
    [MemberData(nameof(Blocks))]
    public void Search_NeverBeatsOptimum_BoundNeverBelowIt_SetsValid_Matched(int block)
    {
        for (var c = 0; c < 8; c++)
        {
            var rng = new Random(70_000 + (block * 100) + c);
            var shape = ((block * 8) + c) % RandomInstances.MatchedShapes.Length;
            var recipe = RandomInstances.Matched(shape);
            var parts = RandomInstances.Parts(
                rng,
                8,
                ReelScaleReferee.Nominals(recipe),
                sigma: 700e-6,
                maxRelU: 150e-6
            );
            Check(recipe, parts, BruteForce.Matched(recipe), $"block {block} case {c} shape {shape}");
        }
    }

    [Theory]
    [MemberData(nameof(Blocks))]
    public void Search_NeverBeatsOptimum_BoundNeverBelowIt_SetsValid_DividerWhereErrorsCancel(int block)
    {
        // A ratio spec: a high upper leg with a high lower leg is a good divider, so sets exist that no common
        // window around the nominal ratio would accept (the spread here is several times the tolerance).
        for (var c = 0; c < 6; c++)
        {
            var rng = new Random(80_000 + (block * 100) + c);
            var series = c % 2 == 0;
            var recipe = RandomInstances.Divider(series, tolPpm: 300);
            var parts = RandomInstances.Parts(rng, 8, series ? [10e3, 5e3] : [10e3], sigma: 1500e-6, maxRelU: 60e-6);
            Check(recipe, parts, BruteForce.Divider(recipe, 300), $"divider block {block} case {c}");
        }
    }

    [Fact]
    public void Search_FindsSetsWhereLegsCancel_TheSweepMisses()
    {
        // Divider out/in = (R2 + R3) / (R1 + R2 + R3) = 2/3 of three 10k legs. R2 at +0.3 % and R3 at -0.3 % sum to
        // the nominal, so with R1 at nominal the ratio is exact although the set spans 0.6 % (textbook identity:
        // the ratio depends on the sums only). 4 parts each at -0.3 %, 0 and +0.3 %: equal-deviation triples give 3
        // sets; one triple of each deviation plus three equal triples give 4, the optimum (12 parts / 3).
        var recipe = RecipeLoader.Load(
            "recipe: div3\nform: network\nground: gnd\nsources:\n  - { name: V1, plus: in, minus: gnd, volts: 10 "
                + "}\npositions:\n"
                + "  - { name: R1, nominal: 10k, between: [in, out] }\n  - { name: R2, nominal: 10k, between: [out, "
                + "mid] }\n"
                + "  - { name: R3, nominal: 10k, between: [mid, gnd] }\n"
                + "outputs:\n  - { name: ratio, kind: voltage-ratio, numerator: out, denominator: in, tolerance-ppm: "
                + "100 }\n",
            "div3.yaml"
        );
        var parts = Enumerable
            .Range(0, 12)
            .Select(i => new PartCandidate(
                i + 1,
                10e3,
                new(10e3 * (1 + ((i % 3) - 1) * 3000e-6 + (i * 1e-6)), 0.05, 0.025),
                $"P{i + 1}"
            ))
            .ToList();

        var options = new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 0);
        var pool = new CandidatePool(recipe, parts, options, withPairs: false);
        var sweep = new SweepPlanner(recipe, pool, new NetworkRule(recipe), options).Run();
        // Without the neighbourhood search the column LP's sets, packed again, reach the optimum too.
        var packed = new SetAssembler(options).Assemble(recipe, parts);
        Assert.Equal(AssemblyMethod.SweepAndColumnLp, packed.Method);
        Assert.Equal(4, packed.Sets.Count);
        AssemblerRefereeTests.AssertSetsValid(recipe, parts, packed, ThreeLegJudge);
        var search = new SetAssembler(new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 6)).Assemble(
            recipe,
            parts
        );
        Assert.Equal(3, sweep.Count);
        Assert.Equal(4, search.Sets.Count);
        Assert.Equal(4, search.UpperBound);
        Assert.True(search.ProvenOptimal);
        AssemblerRefereeTests.AssertSetsValid(recipe, parts, search, ThreeLegJudge);
    }

    // Worst-case ratio error of the three-leg divider, from the textbook partial derivatives of r = (R2 + R3) / T:
    // ∂r/∂R1 = -(R2 + R3) / T², ∂r/∂R2 = ∂r/∂R3 = R1 / T². Score = worst / 100 ppm, null when over.
    private static double? ThreeLegJudge(IReadOnlyList<(double Value, double U)> f)
    {
        var t = f[0].Value + f[1].Value + f[2].Value;
        var r = (f[1].Value + f[2].Value) / t;
        var spread = ((f[0].U * (f[1].Value + f[2].Value)) + ((f[1].U + f[2].U) * f[0].Value)) / (t * t);
        var worst = (Math.Abs(r - (2.0 / 3)) + spread) / (2.0 / 3) * 1e6;
        return worst <= 100 ? worst / 100 : null;
    }

    [Fact]
    public void EverySet_MeetsEverySpec_NoPartTwice_BoundAtLeastSets_Property()
    {
        var cases = (
            from seed in Gen.Choose(0, 1_000_000)
            from shape in Gen.Choose(0, RandomInstances.MatchedShapes.Length)
            from count in Gen.Choose(10, 60)
            select (seed, shape, count)
        ).ToArbitrary();
        Prop.ForAll(cases, c =>
            {
                var rng = new Random(c.seed);
                var (recipe, judge, nominals) =
                    c.shape < RandomInstances.MatchedShapes.Length
                        ? (RandomInstances.Matched(c.shape), (BruteForce.Judge?)null, (double[]?)null)
                        : (RandomInstances.Divider(true, 300), null, [10e3, 5e3]);
                judge ??=
                    recipe.Form == RecipeForm.Matched ? BruteForce.Matched(recipe) : BruteForce.Divider(recipe, 300);
                var parts = RandomInstances.Parts(
                    rng,
                    c.count,
                    nominals ?? ReelScaleReferee.Nominals(recipe),
                    sigma: 1500e-6,
                    maxRelU: 150e-6
                );
                var result = new SetAssembler(new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 10)).Assemble(
                    recipe,
                    parts
                );
                AssemblerRefereeTests.AssertSetsValid(recipe, parts, result, judge);
                Assert.True(
                    result.UpperBound >= result.Sets.Count,
                    $"bound {result.UpperBound} < {result.Sets.Count} sets"
                );
            })
            .Check(Config.QuickThrowOnFailure.WithMaxTest(150).WithQuietOnSuccess(true));
    }

    [Fact]
    public void ZeroTimeLimit_ReturnsTheSweep_WithItsBound_AndReportsProgress()
    {
        var rng = new Random(5);
        var recipe = RandomInstances.Matched(4);
        var parts = RandomInstances.Parts(rng, 120, ReelScaleReferee.Nominals(recipe), sigma: 2000e-6, maxRelU: 150e-6);
        var seen = new List<AssemblyProgress>();
        var quick = new SetAssembler(
            new AssemblyOptions(exactPartLimit: 0, timeLimit: TimeSpan.Zero, progress: new Collect(seen))
        ).Assemble(recipe, parts);
        var longer = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(recipe, parts);
        Assert.Equal(AssemblyMethod.Sweep, quick.Method);
        Assert.Equal(longer.UpperBound, quick.UpperBound);
        Assert.True(longer.Sets.Count >= quick.Sets.Count);
        Assert.Contains(seen, p => p.Phase == "sweep" && p.UpperBound == quick.UpperBound);
    }

    [Fact]
    public void Options_NegativeTimeLimit_NamesTheOption()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() =>
            new AssemblyOptions(timeLimit: TimeSpan.FromSeconds(-1))
        );
        Assert.Equal("timeLimit", e.ParamName);
    }

    private static void Check(Recipe recipe, List<PartCandidate> parts, BruteForce.Judge judge, string label) =>
        ReelScaleReferee.Check(recipe, parts, judge, 2 * recipe.Positions.Count, label);

    private sealed class Collect(List<AssemblyProgress> into) : IProgress<AssemblyProgress>
    {
        public void Report(AssemblyProgress value) => into.Add(value);
    }
}
