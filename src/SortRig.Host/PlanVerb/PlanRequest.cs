using SortRig.Engine.Picking;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Assembly;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.PlanVerb;

/// <summary>A plan request (the plan verb, and library sets when <paramref name="Session"/> is null).</summary>
/// <param name="Database">SQLite path or PostgreSQL connection string.</param>
/// <param name="Session">Session name or id; null for every session's available parts.</param>
/// <param name="Recipe">Recipe file, or a name under recipes/ ("matched-quad").</param>
/// <param name="CsvPath">Where to export the pick list as CSV; null for none.</param>
/// <param name="TakeBy">When set, take the picked parts from the library for this person (all or none).</param>
/// <param name="Mode">How the pick list names parts.</param>
/// <param name="TimeLimit">Search time for large reels; null for the assembler's default (10 s).</param>
internal sealed record PlanRequest(
    string Database,
    string? Session,
    string Recipe,
    string? CsvPath = null,
    string? TakeBy = null,
    PickMode Mode = PickMode.Auto,
    TimeSpan? TimeLimit = null
);
