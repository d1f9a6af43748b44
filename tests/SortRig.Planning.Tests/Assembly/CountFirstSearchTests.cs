using System.Globalization;
using System.Text.RegularExpressions;
using FsCheck;
using FsCheck.Fluent;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The neighbourhood search's count-first windows and its re-pack on fewer parts (a window of many pair options over
/// the exact search's limits), on the ratio set of recipes/ (1k position may be two 2k in parallel, 4k position two 2k
/// in series), judged by the independent matched-form judge of <see cref="BruteForce"/> (the worst-case ratio spread
/// max((x+U)/n) / min((x−U)/n) − 1, restated from the recipe definition, common practice, no source) and against the
/// brute-force optimum (every partition of the parts; textbook set partitioning by restricted-growth strings).
/// </summary>
public sealed partial class CountFirstSearchTests
{
    private static readonly Recipe s_ratioSet = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("ratio-set.yaml")),
        "ratio-set.yaml"
    );

    [Fact]
    public void DensePairs_EverySetMeetsTheSpec_NoPartTwice_BoundAtLeastSets_Property()
    {
        // Dense parts (σ 150 ppm against a 500 ppm window): every 20-part window has hundreds of thousands of
        // assignments, so the re-pack on fewer parts runs.
        var cases = (
            from seed in Gen.Choose(0, 1_000_000)
            from count in Gen.Choose(40, 90)
            select (seed, count)
        ).ToArbitrary();
        Prop.ForAll(cases, c =>
            {
                var parts = RandomInstances.Parts(
                    new Random(c.seed),
                    c.count,
                    [1e3, 2e3, 2e3, 2e3, 2e3, 4e3],
                    sigma: 150e-6,
                    maxRelU: 20e-6
                );
                var result = new SetAssembler(
                    new AssemblyOptions(exactPartLimit: 0, timeLimit: TimeSpan.FromSeconds(1))
                ).Assemble(s_ratioSet, parts);
                AssemblerRefereeTests.AssertSetsValid(s_ratioSet, parts, result, BruteForce.Matched(s_ratioSet));
                Assert.True(result.UpperBound >= result.Sets.Count, $"bound {result.UpperBound} < sets");
            })
            .Check(Config.QuickThrowOnFailure.WithMaxTest(8).WithQuietOnSuccess(true));
    }

    [Fact]
    public void DensePairs_WindowsOverTheLimit_AreRepackedOnFewerParts_AndGainSets()
    {
        var parts = RandomInstances.Parts(
            new Random(17),
            80,
            [1e3, 2e3, 2e3, 2e3, 2e3, 4e3],
            sigma: 150e-6,
            maxRelU: 20e-6
        );
        var sweep = new SetAssembler(new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 0)).Assemble(
            s_ratioSet,
            parts
        );
        var search = new SetAssembler(
            new AssemblyOptions(exactPartLimit: 0, timeLimit: TimeSpan.FromMinutes(5))
        ).Assemble(s_ratioSet, parts);
        var shrunk = int.Parse(ShrunkCount().Match(search.Note).Groups[1].Value, CultureInfo.InvariantCulture);
        Assert.True(shrunk > 0, search.Note);
        Assert.True(search.Sets.Count > sweep.Sets.Count, $"{search.Sets.Count} vs sweep {sweep.Sets.Count}");
        AssemblerRefereeTests.AssertSetsValid(s_ratioSet, parts, search, BruteForce.Matched(s_ratioSet));
    }

    [Fact]
    public void SmallRatioSets_BruteForceNeverBeaten_GapWithinTheBenchmarksFigure()
    {
        // 9 parts of the ratio set, 24 seeds; windows of 20 hold the whole instance, so the count-first skip and the
        // score pass decide. The benchmark's gap for the pair family is 0.7 % (docs/bench-planning.md); here the sum of
        // sets must be within 1 % of the sum of optima, and never above it on any instance.
        int sets = 0,
            optimum = 0;
        for (var seed = 0; seed < 24; seed++)
        {
            var parts = RandomInstances.Parts(
                new Random(60_000 + seed),
                9,
                [1e3, 2e3, 2e3, 2e3, 4e3],
                sigma: 250e-6,
                maxRelU: 40e-6
            );
            var result = new SetAssembler(new AssemblyOptions(exactPartLimit: 0)).Assemble(s_ratioSet, parts);
            var (best, _) = BruteForce.Solve(s_ratioSet, parts, BruteForce.Matched(s_ratioSet));
            Assert.True(result.Sets.Count <= best, $"seed {seed}: {result.Sets.Count} sets > optimum {best}");
            Assert.True(result.UpperBound >= best, $"seed {seed}: bound {result.UpperBound} < optimum {best}");
            AssemblerRefereeTests.AssertSetsValid(s_ratioSet, parts, result, BruteForce.Matched(s_ratioSet));
            (sets, optimum) = (sets + result.Sets.Count, optimum + best);
        }

        Assert.True(optimum >= 10, $"instances too sparse to test: optimum sum {optimum}");
        Assert.True(sets >= 0.99 * optimum, $"sets {sets} vs optimum {optimum}");
    }

    [GeneratedRegex(@"(\d+) re-packed on fewer parts")]
    private static partial Regex ShrunkCount();
}
