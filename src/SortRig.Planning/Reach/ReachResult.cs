namespace SortRig.Planning.Reach;

/// <summary>A single extra part that would make one more set from the parts left over.</summary>
/// <param name="Nominal">Nominal to add, ohms.</param>
/// <param name="LowOhms">Lowest value found to work, ohms.</param>
/// <param name="HighOhms">Highest value found to work, ohms (the band is contiguous on the scan grid).</param>
/// <param name="ExpandedUncertaintyOhms">Expanded transfer uncertainty assumed for the part, ohms.</param>
public sealed record ExtraPart(double Nominal, double LowOhms, double HighOhms, double ExpandedUncertaintyOhms)
{
    /// <summary>Lowest deviation from nominal, ppm.</summary>
    public double LowPpm => ((LowOhms / Nominal) - 1) * 1e6;

    /// <summary>Highest deviation from nominal, ppm.</summary>
    public double HighPpm => ((HighOhms / Nominal) - 1) * 1e6;
}

/// <summary>What the parts on hand can reach.</summary>
/// <param name="RecipeName">Recipe name.</param>
/// <param name="SetsWanted">Sets wanted.</param>
/// <param name="Parts">Parts offered.</param>
/// <param name="Scale">Smallest tolerance scale found at which the sets wanted are still made (1 = the recipe as
/// written).</param>
/// <param name="SetsAtScale">Sets made at <paramref name="Scale"/> (≥ the sets wanted).</param>
/// <param name="TighterScale">The tighter end of the final bracket: fewer sets there.</param>
/// <param name="SetsAtTighter">Sets made at <paramref name="TighterScale"/> (&lt; the sets wanted).</param>
/// <param name="MatchPpm">Matched form: the match at <paramref name="Scale"/>, ppm; null for the network form.</param>
/// <param name="Assemblies">Assembler runs used by the bisection.</param>
/// <param name="SetsAsWritten">Sets made with the recipe as written.</param>
/// <param name="ExtraParts">Per nominal, the value band of one extra part that makes one more set from the parts left
/// over with the recipe as written (keeping every set already made); nominals with no such part are left out.</param>
public sealed record ReachResult(
    string RecipeName,
    int SetsWanted,
    int Parts,
    double Scale,
    int SetsAtScale,
    double TighterScale,
    int SetsAtTighter,
    double? MatchPpm,
    int Assemblies,
    int SetsAsWritten,
    IReadOnlyList<ExtraPart> ExtraParts
);
