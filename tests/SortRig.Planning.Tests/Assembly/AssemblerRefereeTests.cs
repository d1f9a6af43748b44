using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

public sealed class AssemblerRefereeTests
{
    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 10));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void ExactSearch_EqualsBruteForce_OnRandomMatchedInstances(int seedBlock)
    {
        // 10 seed blocks x 8 cases = 80 matched-form instances, every shape, with and without pair builds.
        for (var c = 0; c < 8; c++)
        {
            var rng = new Random((seedBlock * 1000) + c);
            var shape = ((seedBlock * 8) + c) % RandomInstances.MatchedShapes.Length;
            var recipe = RandomInstances.Matched(shape);
            var nominals = ReelScaleReferee.Nominals(recipe);
            var parts = RandomInstances.Parts(rng, rng.Next(5, 9), nominals, sigma: 700e-6, maxRelU: 150e-6);
            AssertMatchesReferee(
                recipe,
                parts,
                BruteForce.Matched(recipe),
                $"block {seedBlock} case {c} shape {shape}"
            );
        }
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    public void ExactSearch_EqualsBruteForce_OnRandomDividerInstances(int seedBlock)
    {
        // 4 x 6 = 24 network-form instances (divider ratio spec, worst case with uncertainty), half allowing a series
        // pair.
        for (var c = 0; c < 6; c++)
        {
            var rng = new Random(50_000 + (seedBlock * 100) + c);
            var series = c % 2 == 0;
            var recipe = RandomInstances.Divider(series, tolPpm: 400);
            var parts = RandomInstances.Parts(
                rng,
                rng.Next(5, 9),
                series ? [10e3, 5e3] : [10e3],
                sigma: 600e-6,
                maxRelU: 100e-6
            );
            AssertMatchesReferee(recipe, parts, BruteForce.Divider(recipe, 400), $"divider block {seedBlock} case {c}");
        }
    }

    private static void AssertMatchesReferee(
        Recipe recipe,
        List<PartCandidate> parts,
        BruteForce.Judge judge,
        string label
    )
    {
        var result = new SetAssembler().Assemble(recipe, parts);
        var (count, score) = BruteForce.Solve(recipe, parts, judge);
        Assert.Equal(AssemblyMethod.Exact, result.Method);
        Assert.True(count == result.Sets.Count, $"{label}: referee {count} sets, assembler {result.Sets.Count}");
        Assert.True(
            Math.Abs(score - result.TotalScore) < 1e-9,
            $"{label}: referee score {score}, assembler {result.TotalScore}"
        );
        AssertSetsValid(recipe, parts, result, judge);
    }

    internal static void AssertSetsValid(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        AssemblyResult result,
        BruteForce.Judge judge
    )
    {
        var ids = result.Sets.SelectMany(s => s.Fills.SelectMany(f => f.Parts)).Select(p => p.Id).ToList();
        Assert.Equal(ids.Count, ids.Distinct().Count());
        Assert.Equal(parts.Count, ids.Count + result.Unused.Count);
        foreach (var set in result.Sets)
        {
            var fills = set
                .Fills.Select(f =>
                    f.Build switch
                    {
                        PositionBuild.Single => (f.Parts[0].Value.Value, f.Parts[0].Value.ExpandedTransfer),
                        _ => (f.Value, f.ExpandedUncertainty),
                    }
                )
                .ToList();
            Assert.True(judge(fills) is not null, $"set {set.Number} fails the referee's judge");
            Assert.All(set.Fills.Zip(recipe.Positions), t => Assert.Equal(t.Second.Name, t.First.Position));
        }
    }
}
