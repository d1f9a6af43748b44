using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

public sealed class SetAssemblerTests
{
    private static readonly AssemblyOptions s_sweepOnly = new(exactPartLimit: 0, neighbourhoodParts: 0);

    private static PartCandidate Part(long id, double nominal, double ppm, double uPpm = 0) =>
        new(
            id,
            nominal,
            new MeasuredValue(nominal * (1 + (ppm * 1e-6)), nominal * uPpm * 1e-6, nominal * uPpm * 0.5e-6),
            null
        );

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void ParallelPair_IsUsed_WhenItGainsASet(bool sweep)
    {
        // Two 1x positions, each may be two 2x parts in parallel. Only one 10k part is near the others; the two 20k
        // parts are +0.5 % and −0.4 %, far apart alone, but in parallel 20.1k || 19.92k = 10.0049k (+490 ppm).
        var recipe = RandomInstances.Matched(3, ppm: 1000);
        var parts = new[] { Part(1, 10e3, 300), Part(2, 10e3, -4000), Part(3, 20e3, 5000), Part(4, 20e3, -4000) };
        var assembler = sweep ? new SetAssembler(s_sweepOnly) : new SetAssembler();
        var result = assembler.Assemble(recipe, parts);
        var set = Assert.Single(result.Sets);
        var pair = Assert.Single(set.Fills, f => f.Build == PositionBuild.Parallel);
        Assert.Equal([3L, 4L], pair.Parts.Select(p => p.Id).Order());
        Assert.Equal(20_100.0 * 19_920 / 40_020, pair.Value, 6);
        Assert.Equal([2L], result.Unused.Select(p => p.Id));

        var singlesOnly = RecipeLoader.Load(
            "recipe: q\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: A, nominal: 10k }\n  - { name: B, "
                + "nominal: 10k }\n",
            "q.yaml"
        );
        Assert.Empty(assembler.Assemble(singlesOnly, parts).Sets);
    }

    [Fact]
    public void Uncertainty_CountsAgainstTheSpec()
    {
        // Values 800 ppm apart meet a 1000 ppm match, but with ±150 ppm expanded transfer uncertainty each the worst
        // case is 800 + 300 = 1100 ppm and the pair is refused.
        var recipe = RandomInstances.Matched(0, ppm: 1000);
        Assert.Single(new SetAssembler().Assemble(recipe, [Part(1, 10e3, 0, 50), Part(2, 10e3, 800, 50)]).Sets);
        Assert.Empty(new SetAssembler().Assemble(recipe, [Part(1, 10e3, 0, 150), Part(2, 10e3, 800, 150)]).Sets);
    }

    [Fact]
    public void TieBreak_PrefersTighterSets()
    {
        // Four parts, two sets either way; {0,100},{900,1000} (spreads 100+100) beats {0,900},{100,1000}.
        var result = new SetAssembler().Assemble(
            RandomInstances.Matched(0),
            [Part(1, 10e3, 0), Part(2, 10e3, 900), Part(3, 10e3, 100), Part(4, 10e3, 1000)]
        );
        Assert.Equal(2, result.Sets.Count);
        Assert.All(result.Sets, s => Assert.True(s.Outputs[0].Value < 101, $"spread {s.Outputs[0].Value} ppm"));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    public void Sweep_EqualsExact_InItsExactCase(int shape)
    {
        // Matched form, no pairs, equal relative uncertainty: the sweep's count must equal the exact search's.
        for (var c = 0; c < 20; c++)
        {
            var rng = new Random(7_000 + (shape * 100) + c);
            var recipe = RandomInstances.Matched(shape);
            var parts = RandomInstances.Parts(
                rng,
                rng.Next(8, 17),
                recipe.Positions.Select(p => p.Nominal).Distinct().ToArray(),
                900e-6,
                120e-6,
                equalU: true
            );
            var exact = new SetAssembler().Assemble(recipe, parts);
            var sweep = new SetAssembler(s_sweepOnly).Assemble(recipe, parts);
            Assert.Equal((AssemblyMethod.Exact, AssemblyMethod.Sweep), (exact.Method, sweep.Method));
            Assert.True(sweep.ProvenOptimal);
            Assert.True(
                exact.Sets.Count == sweep.Sets.Count,
                $"shape {shape} case {c}: exact {exact.Sets.Count}, sweep {sweep.Sets.Count}"
            );
        }
    }

    [Fact]
    public void Sweep_SetsAreAlwaysValid_WithPairsAndUnequalUncertainty()
    {
        for (var c = 0; c < 30; c++)
        {
            var rng = new Random(9_000 + c);
            var shape = c % RandomInstances.MatchedShapes.Length;
            var recipe = RandomInstances.Matched(shape);
            var parts = RandomInstances.Parts(rng, 200, [10e3, 20e3], 2000e-6, 200e-6);
            var result = new SetAssembler(s_sweepOnly).Assemble(recipe, parts);
            Assert.NotEmpty(result.Sets);
            AssemblerRefereeTests.AssertSetsValid(recipe, parts, result, BruteForce.Matched(recipe));
        }
    }

    [Fact]
    public async Task Sweep_OnR2RLadder_ProducesVerifiedSets()
    {
        var recipe = await RecipeLoader.LoadFileAsync(RepoPaths.Recipe("r2r-dac-8bit.yaml"), CancellationToken.None);
        var rng = new Random(3);
        var parts = RandomInstances.Parts(rng, 600, [10e3, 20e3], 3000e-6, 40e-6);
        var result = new SetAssembler().Assemble(recipe, parts);
        // 16 positions: no neighbourhood window holds two sets, so the sweep is followed by the swap/repair move.
        Assert.Equal(AssemblyMethod.SweepAndRepair, result.Method);
        Assert.NotEmpty(result.Sets);
        Assert.All(result.Sets, s => Assert.All(s.Outputs, o => Assert.True(o.Meets, $"set {s.Number} {o.Name}")));
        Assert.Contains(result.Sets, s => s.Fills.Any(f => f.Build == PositionBuild.Series));
    }

    [Fact]
    public void DuplicatePartIds_AreRejected()
    {
        var e = Assert.Throws<ArgumentException>(() =>
            new SetAssembler().Assemble(RandomInstances.Matched(0), [Part(7, 10e3, 0), Part(7, 10e3, 1)])
        );
        Assert.Contains("7", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Options_OutOfRange_NameTheOption()
    {
        var e = Assert.Throws<ArgumentOutOfRangeException>(() => new AssemblyOptions(exactPartLimit: 65));
        Assert.Equal("exactPartLimit", e.ParamName);
    }
}
