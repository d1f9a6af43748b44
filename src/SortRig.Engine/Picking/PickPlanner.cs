using SortRig.Planning.Assembly;
using SortRig.Planning.Networks;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Picking;

/// <summary>Plans the sets of a recipe from logged parts: by part with the set assembler, or by cup and count.
/// Pure.</summary>
internal static class PickPlanner
{
    /// <param name="recipe">Loaded recipe.</param>
    /// <param name="parts">Logged parts (any state; only those <see cref="PlanParts.Offered"/> are used).</param>
    /// <param name="mode">How to name parts; Auto picks cups when every offered part is in a shared cup and the recipe
    /// is matched.</param>
    /// <param name="qualify">Prefix slots and cups with their session (parts from several sessions).</param>
    /// <param name="assembler">The set assembler.</param>
    /// <param name="options">Its options (nominal match window).</param>
    /// <exception cref="ArgumentException">Cups asked for a network-form recipe.</exception>
    public static PlanOutcome Plan(
        Recipe recipe,
        IReadOnlyList<PartRecord> parts,
        PickMode mode,
        bool qualify,
        SetAssembler assembler,
        AssemblyOptions options
    )
    {
        var offered = parts.Where(p => PlanParts.Offered(p, recipe, options)).OrderBy(p => p.Id).ToList();
        var allInCups = offered.Count > 0 && offered.All(PartWhere.InSharedCup);
        if (mode == PickMode.Cups && recipe.Form != RecipeForm.Matched)
        {
            throw new ArgumentException(
                $"--pick cups needs a matched-form recipe; '{recipe.Name}' is a network recipe: use --pick parts"
            );
        }

        if (mode == PickMode.Cups || (mode == PickMode.Auto && allInCups && recipe.Form == RecipeForm.Matched))
        {
            return Explained(ByCup(recipe, offered, options, qualify), recipe, parts, options);
        }

        var result = assembler.Assemble(recipe, offered.Select(p => PlanParts.Candidate(p, qualify)).ToList());
        var list = PickListBuilder.FromAssembly(result);
        var picked = list.Sets.SelectMany(s => s.Items).Select(i => i.PartId!.Value).ToList();
        var note =
            result.Note
            + (result.ProvenOptimal ? "; the number of sets is proven maximal" : "")
            + "\n"
            + AssemblySummary.Line(result);
        if (allInCups)
        {
            note += "; the parts share cups, so telling them apart by id needs each one measured again";
        }

        return Explained(
            new PlanOutcome(list, offered, picked, new Dictionary<(double, string), (double, double)>(), note),
            recipe,
            parts,
            options
        );
    }

    // No set and a position nothing offered can fill: say so, and what the parts on hand are.
    private static PlanOutcome Explained(
        PlanOutcome outcome,
        Recipe recipe,
        IReadOnlyList<PartRecord> parts,
        AssemblyOptions options
    ) =>
        outcome.List.Sets.Count == 0 && MissingNominals.Explain(recipe, parts, outcome.Offered, options) is { } why
            ? outcome with
            {
                Note = outcome.Note + "\n" + why,
            }
            : outcome;

    private static PlanOutcome ByCup(Recipe recipe, List<PartRecord> offered, AssemblyOptions options, bool qualify)
    {
        var cups = CupBands.From(recipe, offered, options, qualify);
        var drafted = PickListBuilder.FromCups(recipe, cups.Select(c => c.Count).ToList());
        var queues = cups.ToDictionary(c => (c.Count.Nominal, c.Count.CupLabel), c => new Queue<long>(c.Members));
        var bands = cups.ToDictionary(c => (c.Count.Nominal, c.Count.CupLabel), c => (c.Count.LowPpm, c.Count.HighPpm));
        var sets = new List<PickSet>();
        var picked = new List<long>();
        foreach (var set in drafted.Sets)
        {
            // The builder adds band spans in ppm; the exact worst case is (1 + high) / (1 + low) - 1. Keep a set only
            // when that meets the tolerance too (it differs by under 1 % of the span for 1 % parts).
            var low = set.Items.Min(i => bands[(i.Nominal, i.Source)].LowPpm);
            var high = set.Items.Max(i => bands[(i.Nominal, i.Source)].HighPpm);
            var worst = ((1 + (high * 1e-6)) / (1 + (low * 1e-6)) - 1) * 1e6;
            if (worst > recipe.MatchTolerancePpm)
            {
                continue;
            }

            picked.AddRange(set.Items.Select(i => queues[(i.Nominal, i.Source)].Dequeue()));
            var check = new OutputCheck("ratio-match", worst, 0, worst, worst, recipe.MatchTolerancePpm, "ppm");
            sets.Add(set with { Number = sets.Count + 1, Outputs = [check], Score = check.Score });
        }

        var list = drafted with
        {
            Sets = sets,
            UnusedPartIds = offered.Select(p => p.Id).Except(picked).Order().ToList(),
        };
        var note =
            $"by cup: each set takes any parts of the named cups; bands from the logged values with U ({cups.Count} "
            + $"cups)";
        return new PlanOutcome(list, offered, picked, bands, note);
    }
}
