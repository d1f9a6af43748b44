namespace SortRig.Host.OrderVerb;

/// <summary>A reach request (the reach verb): what the parts on hand can make.</summary>
/// <param name="Database">SQLite path or PostgreSQL connection string.</param>
/// <param name="Session">Session whose parts are on hand; null for the library's available parts.</param>
/// <param name="Recipe">Recipe file, or a name under recipes/.</param>
/// <param name="Sets">Sets wanted.</param>
/// <param name="TimeLimit">Assembler search time per run; null for the fast sweep (repeatable).</param>
internal sealed record ReachRequest(
    string Database,
    string? Session,
    string Recipe,
    int Sets,
    TimeSpan? TimeLimit = null
);
