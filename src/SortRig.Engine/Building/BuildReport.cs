using SortRig.Engine.Picking;

namespace SortRig.Engine.Building;

/// <summary>How a session sorting toward a build ended.</summary>
/// <param name="RecipeName">The recipe.</param>
/// <param name="Sets">Sets wanted.</param>
/// <param name="Complete">True when the sets were in hand and the session stopped for it.</param>
/// <param name="Line">The last guidance line, or "sets complete: ...".</param>
/// <param name="CsvPath">Where the pick list was exported; null when none was written.</param>
public sealed record BuildReport(string RecipeName, int Sets, bool Complete, string Line, string? CsvPath)
{
    /// <summary>The pick list (complete builds only).</summary>
    internal PlanOutcome? Plan { get; init; }
}
