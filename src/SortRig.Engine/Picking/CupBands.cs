using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>
/// Cup contents of a session from the logged values. Each cup's band is taken from its members, not from the sorting
/// options: low = min((x − U)/n − 1), high = max((x + U)/n − 1) in ppm, U the expanded transfer uncertainty. Any parts
/// picked from cups of one set then have max((x+U)/n) / min((x−U)/n) ≤ (1 + high) / (1 + low), the matched-form rule.
/// </summary>
internal static class CupBands
{
    public static IReadOnlyList<CupContent> From(
        Recipe recipe,
        IEnumerable<PartRecord> parts,
        AssemblyOptions options,
        bool qualify
    )
    {
        var nominals = recipe.Positions.Select(p => p.Nominal).Distinct().ToList();
        var result = new List<CupContent>();
        var groups = parts
            .Where(p => PartWhere.InSharedCup(p) && !PartWhere.InRejectCup(p))
            .Select(p => (Part: p, Nominal: nominals.FirstOrDefault(n => options.SameNominal(p.Nominal, n))))
            .Where(t => t.Nominal > 0)
            .GroupBy(t => (t.Nominal, Label: PartWhere.Of(t.Part, qualify)))
            .OrderBy(g => g.Key.Nominal)
            .ThenBy(g => g.Key.Label, StringComparer.Ordinal);
        foreach (var g in groups)
        {
            var n = g.Key.Nominal;
            var low = g.Min(t => ((t.Part.Value - t.Part.Measured.ExpandedTransfer) / n - 1) * 1e6);
            var high = g.Max(t => ((t.Part.Value + t.Part.Measured.ExpandedTransfer) / n - 1) * 1e6);
            var members = g.Select(t => t.Part.Id).Order().ToList();
            var count = new CupCount(n, g.Key.Label, result.Count, false, members.Count, low, high, 0);
            result.Add(new CupContent(count, members));
        }

        return result;
    }
}
