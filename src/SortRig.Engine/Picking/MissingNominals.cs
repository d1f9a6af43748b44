using System.Globalization;
using SortRig.Measurement.Readings;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>
/// Why a plan made no set when the cause is plain supply: a position of the recipe that no offered part can fill
/// (none of its nominal, nor of the nominal its series/parallel pair takes). Pure.
/// </summary>
internal static class MissingNominals
{
    /// <summary>
    /// One line naming each position no offered part can fill, with the nominals the parts on hand have; null when
    /// every position has at least one candidate (then the values, not the supply, stand in the way).
    /// </summary>
    public static string? Explain(
        Recipe recipe,
        IReadOnlyList<PartRecord> parts,
        IReadOnlyList<PartRecord> offered,
        AssemblyOptions options
    )
    {
        var empty = recipe
            .Positions.Where(pos => !offered.Any(p => PlanParts.Takes(pos, p.Nominal, options)))
            .Select(pos => pos.Name + " (" + Accepted(pos) + ")")
            .ToList();
        if (empty.Count == 0)
        {
            return null;
        }

        var onHand = parts
            .Where(p => p.IsLive)
            .GroupBy(p => p.Nominal)
            .OrderBy(g => g.Key)
            .Select(g => OhmsText.Nominal(g.Key) + " x" + g.Count().ToString(CultureInfo.InvariantCulture))
            .ToList();
        var held = parts.Count(p => p.IsLive && PlanParts.Wanted(p.Nominal, recipe, options)) - offered.Count;
        return "no part to fill "
            + string.Join(", ", empty)
            + "; the parts here are "
            + (onHand.Count == 0 ? "none" : string.Join(", ", onHand))
            + (held > 0 ? $" ({held} of a nominal it takes are rejects, taken or suspect: not offered)" : "");
    }

    private static string Accepted(PositionSpec pos)
    {
        var names = new List<string> { OhmsText.Nominal(pos.Nominal) };
        if (pos.Pairs.HasFlag(PairBuilds.Series))
        {
            names.Add(
                "2 x " + OhmsText.Nominal(PositionSpec.PartNominal(pos.Nominal, PositionBuild.Series)) + " series"
            );
        }

        if (pos.Pairs.HasFlag(PairBuilds.Parallel))
        {
            names.Add(
                "2 x " + OhmsText.Nominal(PositionSpec.PartNominal(pos.Nominal, PositionBuild.Parallel)) + " parallel"
            );
        }

        return string.Join(" or ", names);
    }
}
