using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The reel-scale path (exact search off, neighbourhood windows smaller than the instance) against the independent
/// brute force (<see cref="BruteForce.Solve"/>, every partition of the parts): never more sets than its optimum, a
/// bound never below it, "proven optimal" exactly when sets meet the bound, and every set passing the judge with no
/// part used twice.
/// </summary>
internal static class ReelScaleReferee
{
    public static AssemblyResult Check(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        BruteForce.Judge judge,
        int neighbourhoodParts,
        string label
    )
    {
        var result = new SetAssembler(
            new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: neighbourhoodParts)
        ).Assemble(recipe, parts);
        var (optimum, _) = BruteForce.Solve(recipe, parts, judge);
        Assert.True(result.Sets.Count <= optimum, $"{label}: {result.Sets.Count} sets > optimum {optimum}");
        Assert.True(
            result.UpperBound >= optimum,
            $"{label}: bound {result.UpperBound} < optimum {optimum} ({result.BoundMethod})"
        );
        Assert.Equal(result.Sets.Count == result.UpperBound, result.ProvenOptimal);
        AssemblerRefereeTests.AssertSetsValid(recipe, parts, result, judge);
        return result;
    }

    /// <summary>The nominals a recipe's positions take, with the halves and doubles its pair builds allow.</summary>
    public static double[] Nominals(Recipe recipe) =>
        recipe
            .Positions.SelectMany(p =>
                new[] { p.Nominal }
                    .Concat(p.Pairs.HasFlag(PairBuilds.Series) ? [p.Nominal / 2] : [])
                    .Concat(p.Pairs.HasFlag(PairBuilds.Parallel) ? [p.Nominal * 2] : [])
            )
            .Distinct()
            .ToArray();
}
