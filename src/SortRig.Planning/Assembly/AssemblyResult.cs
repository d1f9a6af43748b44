using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>How a position of one set is filled.</summary>
/// <param name="Position">Position name.</param>
/// <param name="Build">One part, or two in series or parallel.</param>
/// <param name="Parts">The one or two parts used.</param>
/// <param name="Value">Effective resistance, ohms.</param>
/// <param name="ExpandedUncertainty">Expanded transfer uncertainty of the effective value (worst-case sum for pairs),
/// ohms.</param>
public sealed record PositionFill(
    string Position,
    PositionBuild Build,
    IReadOnlyList<PartCandidate> Parts,
    double Value,
    double ExpandedUncertainty
);

/// <summary>One complete set and what it does.</summary>
/// <param name="Number">1-based set number.</param>
/// <param name="Fills">One fill per recipe position, in recipe order.</param>
/// <param name="Outputs">Every output judged (the matched form has one, "ratio-match").</param>
public sealed record AssembledSet(int Number, IReadOnlyList<PositionFill> Fills, IReadOnlyList<OutputCheck> Outputs)
{
    /// <summary>Largest worst-case error as a fraction of its tolerance (≤ 1).</summary>
    public double Score => Outputs.Max(o => o.Score);
}

/// <summary>Which search produced a result.</summary>
public enum AssemblyMethod
{
    /// <summary>Enumeration of every feasible set and exact set packing (memoised branch and bound).</summary>
    Exact,

    /// <summary>One-dimensional window sweep (see docs/planning.md for when it is exact).</summary>
    Sweep,

    /// <summary>The sweep, then large-neighbourhood search: windows of neighbouring sets and leftover parts re-packed
    /// exactly (see docs/planning.md).</summary>
    SweepAndNeighbourhood,

    /// <summary>The sweep, then single-part swap/repair moves between sets and leftovers that free room for new sets,
    /// for recipes whose sets do not fit the neighbourhood window (see docs/planning.md).</summary>
    SweepAndRepair,

    /// <summary>The sweep, then the column LP's feasible sets packed again: an exact cover at the LP's minimum set
    /// cost (optimal when it exists), else local search; the neighbourhood search may follow (see
    /// docs/planning.md).</summary>
    SweepAndColumnLp,

    /// <summary>For networks whose outputs depend on two part ratios (the difference amplifiers): ratio pairs
    /// matched over the whole reel and joined into sets, better than the sweep; the column LP's packing or the
    /// neighbourhood search may follow (see docs/planning.md).</summary>
    RatioPairs,
}

/// <summary>The sets found for a recipe.</summary>
/// <param name="RecipeName">Recipe name.</param>
/// <param name="Sets">Disjoint complete sets meeting every spec in the worst case.</param>
/// <param name="Unused">Parts in no set.</param>
/// <param name="Method">The search used.</param>
/// <param name="ProvenOptimal">True when the set count is proven maximal (exact search, or the sweep in its exact
/// case).</param>
/// <param name="Note">One line on how the result was found.</param>
/// <param name="UpperBound">Proven upper bound on the number of sets any plan can make from these parts (never below
/// the optimum; equal to the set count when <paramref name="ProvenOptimal"/>).</param>
/// <param name="BoundMethod">How <paramref name="UpperBound"/> was proven, in words.</param>
/// <param name="TieBreak">How plans with the same number of sets were told apart, in words.</param>
/// <param name="Elapsed">Wall time of the search.</param>
public sealed record AssemblyResult(
    string RecipeName,
    IReadOnlyList<AssembledSet> Sets,
    IReadOnlyList<PartCandidate> Unused,
    AssemblyMethod Method,
    bool ProvenOptimal,
    string Note,
    int UpperBound,
    string BoundMethod,
    string TieBreak,
    TimeSpan Elapsed
)
{
    /// <summary>Sum of the sets' scores: the tie-break, smaller is better.</summary>
    public double TotalScore => Sets.Sum(s => s.Score);

    /// <summary>(UpperBound − sets) / UpperBound, 0 to 1; 0 when the bound is 0 (nothing can be made).</summary>
    public double Gap => UpperBound == 0 ? 0 : (UpperBound - Sets.Count) / (double)UpperBound;
}
