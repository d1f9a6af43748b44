using SortRig.Planning.Recipes;

namespace SortRig.Engine.Building;

/// <summary>What a session sorts toward: a number of complete sets of one recipe.</summary>
/// <param name="Recipe">The loaded recipe.</param>
/// <param name="Sets">Sets wanted; 1 to 64.</param>
/// <param name="CsvPath">Where the pick list is exported (CSV) once the sets are in hand; null for no file.</param>
public sealed record BuildTarget(Recipe Recipe, int Sets, string? CsvPath)
{
    /// <summary>Largest number of sets a session may sort toward.</summary>
    public const int MaxSets = 64;

    /// <summary>The recipe file it was read from ("" when built in code).</summary>
    public string RecipePath { get; init; } = "";

    /// <summary>The recipe's text as read ("" when built in code); stored with the session for a resume.</summary>
    public string RecipeYaml { get; init; } = "";
}
