using SortRig.Engine.Sorting;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Building;

/// <summary>Reads a session's build target from its options (the recipe file is the edge's only I/O here).</summary>
internal static class BuildTargets
{
    /// <summary>The target, or null when no recipe is given. The recipe path must already be resolved.</summary>
    /// <exception cref="RecipeException">The recipe file is not a valid recipe.</exception>
    public static async Task<BuildTarget?> LoadAsync(SortOptions options, CancellationToken ct)
    {
        if (string.IsNullOrWhiteSpace(options.Recipe))
        {
            return null;
        }

        var yaml = await RecipeLimits.ReadAsync(options.Recipe, ct).ConfigureAwait(false);
        var recipe = RecipeLoader.Load(yaml, options.Recipe);
        return new BuildTarget(recipe, Math.Max(1, options.Sets), CsvPath(options))
        {
            RecipePath = options.Recipe,
            RecipeYaml = yaml,
        };
    }

    /// <summary>The record kept with the session.</summary>
    public static BuildTargetRecord ToRecord(BuildTarget target) =>
        new(target.Recipe.Name, target.RecipePath, target.RecipeYaml, target.Sets, target.CsvPath);

    /// <summary>The target from the session's record (the recipe from its stored text).</summary>
    /// <exception cref="RecipeException">The stored text is no longer a valid recipe.</exception>
    public static BuildTarget FromRecord(BuildTargetRecord record) =>
        new(RecipeLoader.Load(record.RecipeYaml, record.RecipePath), record.Sets, record.CsvPath)
        {
            RecipePath = record.RecipePath,
            RecipeYaml = record.RecipeYaml,
        };

    /// <summary>The pick list's CSV path: the option, else SESSION-sets.csv in the working directory.</summary>
    public static string CsvPath(SortOptions options)
    {
        if (!string.IsNullOrWhiteSpace(options.SetsCsv))
        {
            return options.SetsCsv;
        }

        var invalid = Path.GetInvalidFileNameChars();
        var name = new string(options.Session.Select(c => invalid.Contains(c) ? '_' : c).ToArray());
        return Path.GetFullPath(name + "-sets.csv");
    }
}
