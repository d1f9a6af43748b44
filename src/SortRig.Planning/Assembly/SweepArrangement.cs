using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Puts a swept set's candidates onto positions: pairs on positions allowing that build (those allowing only it
/// first), then singles nearest the common point on the positions with the largest weight (network form).
/// </summary>
internal static class SweepArrangement
{
    public static Option[] Arrange(Recipe recipe, SweepGeometry geo, List<SweepItem> set)
    {
        var fills = new Option[recipe.Positions.Count];
        var centre = (set.Max(i => i.Left) + set.Min(i => i.Right)) / 2;
        for (var j = 0; j < geo.Nominals.Length; j++)
        {
            var free = Enumerable.Range(0, fills.Length).Where(k => geo.ClassOf[k] == j).ToList();
            var mine = set.Where(i => i.Class == j).ToList();
            foreach (var (kind, flag) in new[] { (1, PairBuilds.Series), (2, PairBuilds.Parallel) })
            {
                foreach (var it in mine.Where(i => i.Kind == kind))
                {
                    // Positions allowing only this build first, then those allowing both.
                    var k = free.OrderBy(k => recipe.Positions[k].Pairs == flag ? 0 : 1)
                        .First(k => recipe.Positions[k].Pairs.HasFlag(flag));
                    fills[k] = it.Option;
                    free.Remove(k);
                }
            }

            var singles = mine.Where(i => i.Kind == 0).OrderBy(i => Math.Abs(geo.Z(j, i.Option) - centre)).ToList();
            var byWeight = free.OrderByDescending(k => geo.Weights[k]).ToList();
            for (var s = 0; s < singles.Count; s++)
            {
                fills[byWeight[s]] = singles[s].Option;
            }
        }

        return fills;
    }
}
