using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Engine.Building;

/// <summary>
/// Lower bounds on the parts a build still needs, from counts alone (pure). The recipe's positions fall in classes
/// by nominal; class j needs D_j fills per set. A part of nominal n fills one position of class j (n = j), or half
/// of one as a series (n = j/2) or parallel (n = 2j) pair where the recipe allows it. For any non-empty set C of
/// classes, N sets need N·Σ_{j∈C} D_j fills and each part gives at most one fill to C, so
/// sets ≤ ⌊supply(C) / demand(C)⌋ and at least ⌈N·demand(C) − supply(C)⌉ more parts are needed (a Hall-type count).
/// </summary>
internal static class BuildCounts
{
    /// <summary>Counts for a target of <paramref name="sets"/> sets from parts of the given nominals.</summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="sets">Sets wanted (≥ 1).</param>
    /// <param name="partNominals">Marked nominal of each usable part on hand, ohms.</param>
    /// <param name="options">Nominal match window.</param>
    public static BuildCount Count(Recipe recipe, int sets, IReadOnlyList<double> partNominals, AssemblyOptions options)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(sets, 1);
        var classes = recipe.Positions.Select(p => p.Nominal).Distinct().Order().ToArray();
        var demand = classes.Select(c => recipe.Positions.Count(p => p.Nominal == c)).ToArray();
        var series = classes.Select(c => recipe.Positions.Any(p => p.Nominal == c && p.Pairs.HasFlag(PairBuilds.Series))).ToArray();
        var parallel = classes.Select(c => recipe.Positions.Any(p => p.Nominal == c && p.Pairs.HasFlag(PairBuilds.Parallel))).ToArray();
        var single = new int[partNominals.Count];
        var half = new int[partNominals.Count];
        for (var i = 0; i < partNominals.Count; i++)
        {
            var n = partNominals[i];
            for (var j = 0; j < classes.Length; j++)
            {
                single[i] |= options.SameNominal(n, classes[j]) ? 1 << j : 0;
                half[i] |= (series[j] && options.SameNominal(n, classes[j] / 2)) || (parallel[j] && options.SameNominal(n, classes[j] * 2)) ? 1 << j : 0;
            }
        }

        var bound = int.MaxValue;
        var more = 0;
        var needs = new NominalNeed[classes.Length];
        for (var subset = 1; subset < 1 << Math.Min(classes.Length, 16); subset++)
        {
            var wanted = 0;
            for (var j = 0; j < classes.Length; j++)
            {
                wanted += (subset >> j & 1) * demand[j];
            }

            var supply = Supply(subset, single, half);
            bound = Math.Min(bound, (int)Math.Floor((supply / wanted) + 1e-9));
            more = Math.Max(more, (int)Math.Ceiling((sets * wanted) - supply - 1e-9));
            if ((subset & (subset - 1)) == 0)
            {
                var j = System.Numerics.BitOperations.TrailingZeroCount(subset);
                needs[j] = new NominalNeed(classes[j], sets * demand[j], supply, Math.Max(0, (int)Math.Ceiling((sets * demand[j]) - supply - 1e-9)));
            }
        }

        return new BuildCount(bound == int.MaxValue ? 0 : bound, more, needs);
    }

    // A part counts 1 when it fills a class of the subset by itself, else 1/2 when it is half of a pair for one.
    private static double Supply(int subset, int[] single, int[] half)
    {
        var supply = 0.0;
        for (var i = 0; i < single.Length; i++)
        {
            supply += (single[i] & subset) != 0 ? 1.0 : (half[i] & subset) != 0 ? 0.5 : 0.0;
        }

        return supply;
    }
}
