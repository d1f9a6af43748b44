namespace SortRig.Engine.Building;

/// <summary>The counting view of a build: bounds from part counts alone, no values.</summary>
/// <param name="SetsBound">Upper bound on the sets the parts on hand can make by counts alone.</param>
/// <param name="MoreAtLeast">Parts still needed at least before the target can be met (0 when the counts allow
/// it).</param>
/// <param name="Needs">Per position nominal, in ascending order.</param>
internal sealed record BuildCount(int SetsBound, int MoreAtLeast, IReadOnlyList<NominalNeed> Needs);
