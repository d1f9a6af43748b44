using SortRig.Planning.PickLists;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>A planned pick list and what went into it.</summary>
/// <param name="List">The pick list (sets with outputs and errors).</param>
/// <param name="Offered">Parts offered to the planner: live, Available, of a nominal the recipe uses, not in the reject
/// cup.</param>
/// <param name="PickedIds">Parts the sets use; for cups, that many parts of each named cup, lowest ids first.</param>
/// <param name="CupBands">For cups: each cup's worst-case band, ppm from nominal, by nominal (ohms) and cup label
/// (each batch of a session labels its cups from A); empty otherwise.</param>
/// <param name="Note">How the sets were found, in words.</param>
internal sealed record PlanOutcome(
    PickList List,
    IReadOnlyList<PartRecord> Offered,
    IReadOnlyList<long> PickedIds,
    IReadOnlyDictionary<(double Nominal, string Cup), (double LowPpm, double HighPpm)> CupBands,
    string Note
)
{
    /// <summary>Offered parts in no set, by id.</summary>
    public IReadOnlyList<long> UnusedIds => Offered.Select(p => p.Id).Except(PickedIds).Order().ToList();
}
