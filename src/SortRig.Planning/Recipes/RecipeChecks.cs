using SortRig.Planning.Networks;

namespace SortRig.Planning.Recipes;

/// <summary>Load-time checks that need the circuit solved with nominal parts.</summary>
internal static class RecipeChecks
{
    public static void CheckSolvable(Recipe recipe, YamlCursor root, YamlCursor outputsNode)
    {
        RecipeNetwork network;
        try
        {
            network = new RecipeNetwork(recipe);
        }
        catch (InvalidOperationException e)
        {
            throw root.Required("positions", "positions")
                .Error("a circuit that solves with nominal parts: " + e.Message);
        }

        // Every output must be finite with nominal parts, with finite sensitivities: an explicit target hides a ratio
        // whose denominator is 0 V at nominal (e.g. a gain input tied to no source), so the value is checked too.
        var items = outputsNode.Items();
        var atNominal = network.Evaluate(recipe.Positions.Select(p => p.Nominal).ToArray());
        for (var i = 0; i < recipe.Outputs.Count; i++)
        {
            var t = network.Target(i);
            var v = atNominal[i];
            var finite =
                double.IsFinite(t)
                && double.IsFinite(v.Value)
                && double.IsFinite(v.Error)
                && v.ErrorGradient.All(double.IsFinite);
            if (!finite || (recipe.Outputs[i] is VoltageRatioSpec && t == 0))
            {
                throw items[i]
                    .Error(
                        string.Create(
                            System.Globalization.CultureInfo.InvariantCulture,
                            $"an output whose value with nominal parts is finite and, for a ratio, whose target and "
                                + $"denominator are not zero (got {v.Value:G6}, target {t:G6})"
                        )
                    );
            }
        }
    }
}
