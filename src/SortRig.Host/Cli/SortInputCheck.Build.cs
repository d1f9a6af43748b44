using System.Globalization;
using SortRig.Engine.Building;
using SortRig.Engine.Picking;
using SortRig.Engine.Sorting;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Host.Cli;

internal static partial class SortInputCheck
{
    // Sorting toward a build: --sets needs --recipe; the recipe must load and take the batch's nominal; the pick
    // list's folder must exist. Resolves the recipe to its full path (a name under recipes/ works too).
    private static string? CheckBuild(SortOptions options, FlagMap? flags)
    {
        var recipeFlag = Name(nameof(SortOptions.Recipe), flags);
        if (string.IsNullOrWhiteSpace(options.Recipe))
        {
            return options.Sets > 0
                ? $"{Name(nameof(SortOptions.Sets), flags)}: {options.Sets.ToString(CultureInfo.InvariantCulture)} "
                    + $"sets of what? give the recipe too ({recipeFlag} FILE)"
                : null;
        }

        string path;
        Recipe recipe;
        try
        {
            path = Path.GetFullPath(PlanRunner.RecipePath(options.Recipe));
            recipe = RecipeLoader.Load(File.ReadAllText(path), path);
        }
        catch (VerbException e)
        {
            return recipeFlag + e.Message[e.Message.IndexOf(':', StringComparison.Ordinal)..];
        }
        catch (Exception e) when (e is RecipeException or IOException or UnauthorizedAccessException)
        {
            return $"{recipeFlag}: {e.Message}";
        }

        if (!PlanParts.Wanted(options.Nominal, recipe, new AssemblyOptions()))
        {
            var takes = string.Join(", ", recipe.Positions.Select(p => BuildStatus.Ohms(p.Nominal)).Distinct());
            return string.Create(
                CultureInfo.InvariantCulture,
                $"{Name(nameof(SortOptions.Nominal), flags)}: {options.Nominal:G6} Ohm is not a nominal recipe '"
                    + $"{recipe.Name}' takes ({takes}, or their pair halves where allowed)"
            );
        }

        if (
            !string.IsNullOrWhiteSpace(options.SetsCsv)
            && Path.GetDirectoryName(Path.GetFullPath(options.SetsCsv)) is { } folder
            && !Directory.Exists(folder)
        )
        {
            return $"{Name(nameof(SortOptions.SetsCsv), flags)}: no folder '{folder}' to write the pick list in";
        }

        options.Recipe = path;
        return null;
    }
}
