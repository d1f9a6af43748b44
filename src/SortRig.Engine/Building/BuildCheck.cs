using SortRig.Engine.Picking;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Building;

/// <summary>
/// Decides, after each part, whether the target's sets can be formed from the parts on hand: the part counts first
/// (<see cref="BuildCounts"/>, no search while they say no), then the set assembler, the same one the plan verb uses,
/// on the logged values (already on the session's reference scale when a range transfer applies). Pure: no I/O.
/// </summary>
/// <param name="target">The target.</param>
/// <param name="options">Assembler limits for the check (a short time limit keeps the check cheap).</param>
/// <param name="stockTolerance">Stock tolerance of the reel, fraction: the span the completing band is searched
/// in.</param>
internal sealed class BuildCheck(BuildTarget target, AssemblyOptions options, double stockTolerance)
{
    // Most offered parts for which the completing band is probed (each probe is one assembly).
    private const int ProbePartLimit = 40;
    private const int ProbeSteps = 81;

    private readonly SetAssembler _assembler = new(options);

    /// <summary>The assembler options in use.</summary>
    public AssemblyOptions Options => options;

    /// <summary>Evaluates the build.</summary>
    /// <param name="parts">Every logged part of the session (any state; only those the plan verb would offer are
    /// used).</param>
    /// <param name="feeding">Nominal of the batch being fed, ohms (preferred on ties).</param>
    public BuildStatus Evaluate(IReadOnlyList<PartRecord> parts, double feeding)
    {
        var recipe = target.Recipe;
        var offered = parts.Where(p => PlanParts.Offered(p, recipe, options)).OrderBy(p => p.Id).ToList();
        var count = BuildCounts.Count(recipe, target.Sets, offered.Select(p => p.Nominal).ToList(), options);
        var feed = FeedNext(count, feeding);
        if (count.MoreAtLeast > 0)
        {
            var band = count.MoreAtLeast == 1 ? Probe(offered, feed) : null;
            return new BuildStatus(target, count, false, 0, null, feed, band);
        }

        var plan = PickPlanner.Plan(recipe, parts, PickMode.Parts, qualify: false, _assembler, options);
        var found = plan.List.Sets.Count;
        if (found >= target.Sets)
        {
            return new BuildStatus(target, count, true, found, Trim(PreferCups(recipe, parts, plan)), null, null);
        }

        return new BuildStatus(target, count, true, found, null, feed, Probe(offered, feed));
    }

    // Parts sorted into shared cups of a one-nominal matched recipe are picked by cup when the cups' bands alone make
    // the sets. Not for several nominals: each batch labels its cups from A again, and the by-cup planner keys bands
    // by label alone.
    private PlanOutcome PreferCups(Recipe recipe, IReadOnlyList<PartRecord> parts, PlanOutcome byPart)
    {
        var offered = byPart.Offered;
        if (
            recipe.Form != RecipeForm.Matched
            || recipe.Positions.Select(p => p.Nominal).Distinct().Count() > 1
            || offered.Count == 0
            || !offered.All(PartWhere.InSharedCup)
        )
        {
            return byPart;
        }

        var byCup = PickPlanner.Plan(recipe, parts, PickMode.Cups, qualify: false, _assembler, options);
        return byCup.List.Sets.Count >= target.Sets ? byCup : byPart;
    }

    private PlanOutcome Trim(PlanOutcome plan)
    {
        if (plan.List.Sets.Count <= target.Sets)
        {
            return plan;
        }

        var sets = plan.List.Sets.Take(target.Sets).ToList();
        var picked =
            plan.List.Source == PickSource.Cups
                ? plan.PickedIds.Take(sets.Sum(s => s.Items.Count)).ToList()
                : sets.SelectMany(s => s.Items).Select(i => i.PartId!.Value).ToList();
        var unused = plan.Offered.Select(p => p.Id).Except(picked).Order().ToList();
        var list = plan.List with { Sets = sets, UnusedPartIds = plan.List.Source == PickSource.Cups ? [] : unused };
        return plan with { List = list, PickedIds = picked };
    }

    // The nominal whose fills are shortest relative to what the target wants; the batch's own on a tie.
    private static double FeedNext(BuildCount count, double feeding) =>
        count.Needs.OrderBy(n => n.OnHand / n.Wanted).ThenBy(n => Math.Abs(n.Nominal - feeding)).First().Nominal;

    // Matched form, few parts: a hypothetical part of the nominal to feed, at values across the stock band, added to
    // the parts on hand; the widest run of values with which the assembler makes the target is the completing band.
    private (double LowPpm, double HighPpm)? Probe(List<PartRecord> offered, double? feed)
    {
        if (feed is not { } nominal || target.Recipe.Form != RecipeForm.Matched || offered.Count > ProbePartLimit)
        {
            return null;
        }

        var candidates = offered.Select(p => PlanParts.Candidate(p, qualify: false)).ToList();
        var same = offered
            .Where(p => options.SameNominal(p.Nominal, nominal))
            .Select(p => p.Measured.ExpandedTransfer / p.Value)
            .Order()
            .ToList();
        var relativeU = same.Count > 0 ? same[same.Count / 2] : 0;
        var span = stockTolerance * 1e6;
        var step = 2 * span / (ProbeSteps - 1);
        (double Low, double High)? best = null;
        double? runStart = null;
        for (var k = 0; k <= ProbeSteps; k++)
        {
            var ppm = -span + (k * step);
            var completes = k < ProbeSteps && Completes(candidates, nominal, ppm, relativeU);
            if (completes)
            {
                runStart ??= ppm;
            }
            else if (runStart is { } start)
            {
                var end = ppm - step;
                if (best is null || end - start > best.Value.High - best.Value.Low)
                {
                    best = (start, end);
                }

                runStart = null;
            }
        }

        return best;
    }

    private bool Completes(List<PartCandidate> candidates, double nominal, double ppm, double relativeU)
    {
        var value = nominal * (1 + (ppm * 1e-6));
        var u = value * relativeU / 2;
        var probe = new PartCandidate(-1, nominal, new MeasuredValue(value, u, u), null);
        return _assembler.Assemble(target.Recipe, [.. candidates, probe]).Sets.Count >= target.Sets;
    }
}
