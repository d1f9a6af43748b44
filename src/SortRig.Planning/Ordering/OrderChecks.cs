using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Ordering;

/// <summary>Questions without an answer, found before any trial runs.</summary>
internal static class OrderChecks
{
    /// <summary>
    /// Refuses a recipe whose tolerance is tighter than the meter can resolve: a set of parts exactly at nominal passes
    /// with no uncertainty but fails with the given one, so no stock can ever pass.
    /// </summary>
    public static void Resolvable(
        Recipe recipe,
        double uncertainty,
        SetAssembler assembler,
        CancellationToken cancellationToken
    )
    {
        if (
            IdealSetPasses(recipe, uncertainty, assembler, cancellationToken)
            || !IdealSetPasses(recipe, 0, assembler, cancellationToken)
        )
        {
            return;
        }

        var detail =
            recipe.Form == RecipeForm.Matched
                ? string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"two parts exactly at nominal show {((1 + uncertainty) / (1 - uncertainty) - 1) * 1e6:0.#} ppm "
                        + $"against its {recipe.MatchTolerancePpm:0.#} ppm"
                )
                : "a set exactly at nominal fails its outputs";
        throw new OrderRefusedException(
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"recipe '{recipe.Name}' is tighter than the meter can resolve: at {uncertainty * 1e6:0.#} ppm "
                    + $"transfer uncertainty {detail}"
            )
        );
    }

    private static bool IdealSetPasses(
        Recipe recipe,
        double uncertainty,
        SetAssembler assembler,
        CancellationToken cancellationToken
    )
    {
        var parts = recipe
            .Positions.Select(
                (p, i) =>
                {
                    var u = p.Nominal * uncertainty / 2;
                    return new PartCandidate(i, p.Nominal, new MeasuredValue(p.Nominal, u, u), null);
                }
            )
            .ToList();
        return assembler.Assemble(recipe, parts, cancellationToken).Sets.Count == 1;
    }
}
