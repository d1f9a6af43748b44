namespace SortRig.Planning.Recipes;

/// <summary>Ways a position may be built besides one part of its own nominal.</summary>
[Flags]
public enum PairBuilds
{
    /// <summary>One part only.</summary>
    None = 0,

    /// <summary>Two parts of half the nominal in series.</summary>
    Series = 1,

    /// <summary>Two parts of twice the nominal in parallel.</summary>
    Parallel = 2,
}

/// <summary>How one position of a set is actually built.</summary>
public enum PositionBuild
{
    /// <summary>One part of the position's nominal.</summary>
    Single,

    /// <summary>Two parts of half the nominal in series.</summary>
    Series,

    /// <summary>Two parts of twice the nominal in parallel.</summary>
    Parallel,
}

/// <summary>One resistor position of a recipe.</summary>
/// <param name="Name">Position name, unique in the recipe (e.g. "R3").</param>
/// <param name="Nominal">Nominal resistance of the position, ohms (&gt; 0).</param>
/// <param name="Pairs">Pair builds the recipe allows for this position.</param>
/// <param name="NodeA">Network form: first node; null in the matched form.</param>
/// <param name="NodeB">Network form: second node; null in the matched form.</param>
public sealed record PositionSpec(
    string Name,
    double Nominal,
    PairBuilds Pairs,
    string? NodeA = null,
    string? NodeB = null
)
{
    /// <summary>Nominal of each of the two parts for a pair build, ohms (half for series, twice for
    /// parallel).</summary>
    public static double PartNominal(double positionNominal, PositionBuild build) =>
        build switch
        {
            PositionBuild.Series => positionNominal / 2.0,
            PositionBuild.Parallel => positionNominal * 2.0,
            _ => positionNominal,
        };
}
