using SortRig.Planning.Recipes;

namespace SortRig.Planning.Networks;

/// <summary>Judges a network recipe's outputs for given position values. Pure computation.</summary>
public static class NetworkEvaluator
{
    /// <summary>Evaluates every output of a network-form recipe.</summary>
    /// <param name="recipe">A network-form recipe.</param>
    /// <param name="values">Value of every position by name, ohms.</param>
    /// <param name="expandedUncertainties">Expanded transfer uncertainty of each position by name, ohms; missing =
    /// 0.</param>
    /// <returns>One check per output, in recipe order.</returns>
    public static IReadOnlyList<OutputCheck> Evaluate(
        Recipe recipe,
        IReadOnlyDictionary<string, double> values,
        IReadOnlyDictionary<string, double>? expandedUncertainties = null
    )
    {
        var network = new RecipeNetwork(recipe);
        var v = recipe
            .Positions.Select(p =>
                values.TryGetValue(p.Name, out var x)
                    ? x
                    : throw new ArgumentException($"no value for position '{p.Name}'", nameof(values))
            )
            .ToArray();
        var u = recipe.Positions.Select(p => expandedUncertainties?.GetValueOrDefault(p.Name) ?? 0.0).ToArray();
        return Checks(recipe, network.Evaluate(v), u);
    }

    internal static OutputCheck[] Checks(Recipe recipe, OutputValue[] outputs, ReadOnlySpan<double> uncertainties)
    {
        var result = new OutputCheck[outputs.Length];
        for (var i = 0; i < outputs.Length; i++)
        {
            var o = outputs[i];
            var spread = 0.0;
            for (var k = 0; k < uncertainties.Length; k++)
            {
                spread += Math.Abs(o.ErrorGradient[k]) * uncertainties[k];
            }

            result[i] = new OutputCheck(
                recipe.Outputs[i].Name,
                o.Value,
                o.Target,
                o.Error,
                Math.Abs(o.Error) + spread,
                o.Tolerance,
                o.Unit
            );
        }

        return result;
    }
}
