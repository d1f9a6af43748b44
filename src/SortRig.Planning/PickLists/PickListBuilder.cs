using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.PickLists;

/// <summary>Turns assembled sets, or cup contents, into a pick list. Pure computation.</summary>
public static class PickListBuilder
{
    /// <summary>Pick list from the assembler's sets: every part by id and location (slot label).</summary>
    public static PickList FromAssembly(AssemblyResult result)
    {
        var sets = result
            .Sets.Select(s => new PickSet(
                s.Number,
                s.Fills.SelectMany(f =>
                        f.Parts.Select(p => new PickItem(
                            f.Position,
                            f.Build.ToString().ToLowerInvariant(),
                            p.Id,
                            p.Location ?? "",
                            p.Nominal,
                            p.Value.Value
                        ))
                    )
                    .ToList(),
                s.Outputs,
                s.Score
            ))
            .ToList();
        return new PickList(result.RecipeName, PickSource.Slots, sets, result.Unused.Select(p => p.Id).ToList());
    }

    /// <summary>
    /// Pick list by cup and count for a matched-form recipe: each set takes, for every nominal, as many parts as it has
    /// positions of that nominal from one cup, choosing cups whose bands together span no more than the match
    /// tolerance. The ratio error reported is that span, a bound on the values' spread (uncertainty not included).
    /// </summary>
    /// <exception cref="ArgumentException">The recipe is not in the matched form.</exception>
    public static PickList FromCups(Recipe recipe, IReadOnlyList<CupCount> counts)
    {
        if (recipe.Form != RecipeForm.Matched)
        {
            throw new ArgumentException("picking by cup needs a matched-form recipe", nameof(recipe));
        }

        var left = counts.Where(c => !c.IsReject).ToDictionary(c => (c.Nominal, c.CupLabel), c => c.Count);
        var demand = recipe.SinglePartDemand;
        var sets = new List<PickSet>();
        while (NextSet(recipe, counts, demand, left) is { } choice)
        {
            var items = new List<PickItem>();
            foreach (var pos in recipe.Positions)
            {
                var cup = choice.Single(c => c.Nominal == pos.Nominal);
                items.Add(new PickItem(pos.Name, "single", null, cup.CupLabel, pos.Nominal, null));
            }

            var span = choice.Max(c => c.HighPpm) - choice.Min(c => c.LowPpm);
            var check = new OutputCheck("ratio-match", span, 0, span, span, recipe.MatchTolerancePpm, "ppm");
            sets.Add(new PickSet(sets.Count + 1, items, [check], check.Score));
        }

        return new PickList(recipe.Name, PickSource.Cups, sets, []);
    }

    private static List<CupCount>? NextSet(
        Recipe recipe,
        IReadOnlyList<CupCount> counts,
        IReadOnlyDictionary<double, int> demand,
        Dictionary<(double, string), int> left
    )
    {
        List<CupCount>? best = null;
        var bestSpan = double.MaxValue;
        var first = demand.Keys.First();
        foreach (
            var anchor in counts.Where(c =>
                !c.IsReject && c.Nominal == first && left[(c.Nominal, c.CupLabel)] >= demand[first]
            )
        )
        {
            var choice = new List<CupCount> { anchor };
            foreach (var n in demand.Keys.Skip(1))
            {
                var pick = counts
                    .Where(c => !c.IsReject && c.Nominal == n && left[(c.Nominal, c.CupLabel)] >= demand[n])
                    .OrderBy(c => Math.Abs(((c.LowPpm + c.HighPpm) / 2) - ((anchor.LowPpm + anchor.HighPpm) / 2)))
                    .FirstOrDefault();
                if (pick is null)
                {
                    break;
                }

                choice.Add(pick);
            }

            var span = choice.Max(c => c.HighPpm) - choice.Min(c => c.LowPpm);
            if (choice.Count == demand.Count && span <= recipe.MatchTolerancePpm + 1e-9 && span < bestSpan)
            {
                (best, bestSpan) = (choice, span);
            }
        }

        foreach (var c in best ?? [])
        {
            left[(c.Nominal, c.CupLabel)] -= demand[c.Nominal];
        }

        return best;
    }
}
