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
            throw root.Required("positions", "positions").Error("a circuit that solves with nominal parts: " + e.Message);
        }

        var items = outputsNode.Items();
        for (var i = 0; i < recipe.Outputs.Count; i++)
        {
            var t = network.Target(i);
            if (!double.IsFinite(t) || (recipe.Outputs[i] is VoltageRatioSpec && t == 0))
            {
                throw items[i].Error($"an output whose nominal value is finite and, for a ratio, not zero (got {t})");
            }
        }
    }
}
