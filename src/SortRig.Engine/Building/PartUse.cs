using System.Globalization;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Engine.Building;

/// <summary>Whether a measured part can help a build, and why not.</summary>
/// <param name="Helps">False when no set of the recipe could use the part.</param>
/// <param name="Reason">Why it cannot help, in words; empty when it helps.</param>
internal sealed record PartUse(bool Helps, string Reason)
{
    private static readonly PartUse s_helps = new(true, "");

    /// <summary>
    /// Judges one part. It cannot help when its nominal is one no position takes (singly or as half of an allowed
    /// pair), or, in the matched form, when its worst-case interval [(x − U)/n, (x + U)/n] cannot share a window of the
    /// match tolerance with any partner from the stock band [1 − t, 1 + t] of the nominal (partners taken at their
    /// best, without uncertainty, so the test never turns away a part some set could use). Network recipes turn away
    /// only parts of an unused nominal: partners of other values may compensate a deviation.
    /// </summary>
    /// <param name="recipe">The recipe.</param>
    /// <param name="nominal">The part's marked nominal, ohms.</param>
    /// <param name="value">Its value on the session's reference scale.</param>
    /// <param name="stockTolerance">Stock tolerance of the reel, fraction.</param>
    /// <param name="options">Nominal match window.</param>
    public static PartUse Judge(
        Recipe recipe,
        double nominal,
        MeasuredValue value,
        double stockTolerance,
        AssemblyOptions options
    )
    {
        if (!Picking.PlanParts.Wanted(nominal, recipe, options))
        {
            return new PartUse(
                false,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"no position of {recipe.Name} takes {BuildStatus.Ohms(nominal)} parts"
                )
            );
        }

        if (recipe.Form != RecipeForm.Matched)
        {
            return s_helps;
        }

        var window = 1 + (recipe.MatchTolerancePpm * 1e-6);
        var low = (value.Value - value.ExpandedTransfer) / nominal;
        var high = (value.Value + value.ExpandedTransfer) / nominal;
        if (low <= 0 || high / low > window)
        {
            return new PartUse(false, "its uncertainty alone is wider than the match tolerance");
        }

        if (high > (1 + stockTolerance) * window || low < (1 - stockTolerance) / window)
        {
            var ppm = (value.Value / nominal - 1) * 1e6;
            return new PartUse(
                false,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"at {ppm:+0;-0} ppm no part within the reel's ±{stockTolerance * 1e6:0} ppm can match it within "
                        + $"{recipe.MatchTolerancePpm:0.###} ppm"
                )
            );
        }

        return s_helps;
    }
}
