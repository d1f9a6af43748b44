using SortRig.Planning.Recipes;

namespace SortRig.Planning.Reach;

/// <summary>A recipe with every tolerance multiplied by one factor (the match of the matched form, every output's
/// tolerance of the network form).</summary>
public static class ToleranceScale
{
    /// <summary>The recipe with its tolerances scaled.</summary>
    /// <param name="recipe">A loaded recipe.</param>
    /// <param name="scale">Factor, finite and &gt; 0 (1 = the recipe as written).</param>
    public static Recipe Apply(Recipe recipe, double scale)
    {
        ArgumentNullException.ThrowIfNull(recipe);
        if (!(scale > 0) || !double.IsFinite(scale))
        {
            throw new ArgumentOutOfRangeException(nameof(scale), scale, "the tolerance scale must be finite and > 0");
        }

        return recipe.Form == RecipeForm.Matched
            ? recipe with
            {
                MatchTolerancePpm = recipe.MatchTolerancePpm * scale,
            }
            : recipe with
            {
                Outputs = recipe.Outputs.Select(o => Scaled(o, scale)).ToList(),
            };
    }

    private static OutputSpec Scaled(OutputSpec output, double scale) =>
        output switch
        {
            NodeVoltageSpec v => v with { ToleranceVolts = v.ToleranceVolts * scale },
            VoltageRatioSpec r => r with { TolerancePpm = r.TolerancePpm * scale },
            PositionRatioSpec p => p with { TolerancePpm = p.TolerancePpm * scale },
            _ => throw new NotSupportedException($"output kind {output.GetType().Name} has no tolerance to scale"),
        };
}
