using SortRig.Planning.Networks;

namespace SortRig.Planning.Recipes;

/// <summary>How a recipe judges a set.</summary>
public enum RecipeForm
{
    /// <summary>Simple form: every position's value over its nominal agrees with the others within a ratio
    /// tolerance.</summary>
    Matched,

    /// <summary>Full form: a small netlist; the set is judged on the circuit's outputs against their specs.</summary>
    Network,
}

/// <summary>
/// A validated recipe: what one set is made of and how it is accepted. Immutable; built by <see cref="RecipeLoader"/>.
/// </summary>
/// <param name="Name">Recipe name from the <c>recipe</c> field.</param>
/// <param name="Description">Free text, or null.</param>
/// <param name="Form">Simple (matched) or full (network) form.</param>
/// <param name="Positions">The positions one set fills, in file order.</param>
/// <param name="MatchTolerancePpm">Matched form only: largest allowed ratio spread between positions, ppm (&gt; 0). 0
/// for the network form.</param>
/// <param name="Network">Network form only: the netlist (positions are its resistors); null for the matched
/// form.</param>
/// <param name="Outputs">Network form only: the output specs; empty for the matched form.</param>
/// <param name="SourceName">File name the recipe was read from, for messages.</param>
public sealed record Recipe(
    string Name,
    string? Description,
    RecipeForm Form,
    IReadOnlyList<PositionSpec> Positions,
    double MatchTolerancePpm,
    Netlist? Network,
    IReadOnlyList<OutputSpec> Outputs,
    string SourceName
)
{
    /// <summary>Number of single parts of each nominal (ohms) one set needs when every position is one part.</summary>
    public IReadOnlyDictionary<double, int> SinglePartDemand =>
        Positions.GroupBy(p => p.Nominal).ToDictionary(g => g.Key, g => g.Count());
}
