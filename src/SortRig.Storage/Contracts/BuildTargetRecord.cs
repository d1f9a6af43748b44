namespace SortRig.Storage.Contracts;

/// <summary>The build a session sorts toward, kept so that a stopped session resumes toward the same target.</summary>
/// <param name="RecipeName">The recipe's name, non-empty.</param>
/// <param name="RecipePath">The file it was read from, non-empty (for messages; the text below is what counts).</param>
/// <param name="RecipeYaml">The recipe's text as it was read, non-empty.</param>
/// <param name="Sets">Sets wanted, 1 to 64.</param>
/// <param name="CsvPath">Where the pick list is exported, or null.</param>
public sealed record BuildTargetRecord(
    string RecipeName,
    string RecipePath,
    string RecipeYaml,
    int Sets,
    string? CsvPath
);
