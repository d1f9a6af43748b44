namespace SortRig.Engine.Building;

/// <summary>What one nominal of the recipe still lacks, by counting parts only.</summary>
/// <param name="Nominal">Position nominal, ohms.</param>
/// <param name="Wanted">Fills the target needs: sets × positions of this nominal.</param>
/// <param name="OnHand">Fills the parts on hand give it (at most <paramref name="Wanted"/>): one per part of this
/// nominal, one half per leftover part that may be one of a series or parallel pair for it.</param>
/// <param name="StillNeeded">⌈Wanted − OnHand⌉: parts of this nominal still needed at least (fewer parts never do,
/// since a part gives at most one fill).</param>
internal sealed record NominalNeed(double Nominal, int Wanted, double OnHand, int StillNeeded);
