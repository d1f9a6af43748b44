using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>Which logged parts a plan may use, and how they are offered to the set assembler.</summary>
internal static class PlanParts
{
    /// <summary>
    /// Live (Accepted/Announced), library status Available, not suspect after a check out of control, not in the
    /// reject cup (rejects sit mixed in one cup), and of a nominal some position of the recipe takes, singly or as a
    /// series/parallel pair.
    /// </summary>
    public static bool Offered(PartRecord part, Recipe recipe, AssemblyOptions options) =>
        part.IsLive
        && !part.Suspect
        && part.LibraryStatus == LibraryStatus.Available
        && !PartWhere.InRejectCup(part)
        && Wanted(part.Nominal, recipe, options);

    /// <summary>True when some position takes a part of this nominal.</summary>
    public static bool Wanted(double nominal, Recipe recipe, AssemblyOptions options) =>
        recipe.Positions.Any(pos => Takes(pos, nominal, options));

    /// <summary>True when the position takes a part of this nominal, singly or as one of a series/parallel
    /// pair.</summary>
    public static bool Takes(PositionSpec position, double nominal, AssemblyOptions options) =>
        options.SameNominal(nominal, position.Nominal)
        || (
            position.Pairs.HasFlag(PairBuilds.Series)
            && options.SameNominal(nominal, PositionSpec.PartNominal(position.Nominal, PositionBuild.Series))
        )
        || (
            position.Pairs.HasFlag(PairBuilds.Parallel)
            && options.SameNominal(nominal, PositionSpec.PartNominal(position.Nominal, PositionBuild.Parallel))
        );

    /// <summary>The part as the assembler sees it: id, nominal, value with uncertainties, and where to find
    /// it.</summary>
    public static PartCandidate Candidate(PartRecord part, bool qualify) =>
        new(part.Id, part.Nominal, part.Measured, PartWhere.Of(part, qualify));
}
