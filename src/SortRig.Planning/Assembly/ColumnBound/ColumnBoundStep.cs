using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Tightens the assembler's proven bound with the column LP (<see cref="ColumnBoundSolver"/>) where it can help and
/// fits: up to <see cref="EnumerateParts"/> usable parts any form (every feasible set enumerated), above that the
/// matched form (exact pricing, <see cref="MatchedPricing"/>) and network recipes of at most
/// <see cref="MaxNetworkPositions"/> positions up to <see cref="MaxNetworkParts"/> parts (exact pricing by
/// interval search, <see cref="NetworkPricing"/>), and 4-position networks whose outputs depend on two position ratios
/// (the difference amplifiers; <see cref="RatioPairPricing"/>, duals per bin of parts) likewise; the part-count bound
/// above the sets found; for the matched form above <see cref="MaxParts"/> usable parts (up to
/// <see cref="MaxMatchedParts"/>) the master pools the common parts by nominal (<see cref="AggregatedColumnBound"/>):
/// with a row per part on a 1 000-part reel of the ratio set the LP had not converged after minutes
/// (docs/planning.md). Anytime: the best bound proven before the stop is kept. The smaller of the two bounds is
/// returned with its name.
/// </summary>
internal static class ColumnBoundStep
{
    /// <summary>Largest number of usable parts of the matched form whose master has a row per part.</summary>
    public const int MaxParts = 400;

    /// <summary>Largest number of usable parts the column bound runs on for the matched form (above
    /// <see cref="MaxParts"/> with the pooled master; the 10 000-part quads keep the part count).</summary>
    public const int MaxMatchedParts = 2_000;

    /// <summary>Up to this many usable parts every feasible set is enumerated (<see cref="EnumeratedPricing"/>, any
    /// form); above it only the matched form is priced.</summary>
    public const int EnumerateParts = 40;

    /// <summary>
    /// Most positions of a network recipe the column LP runs on above <see cref="EnumerateParts"/> parts: the pricing
    /// enumerates every prefix of all positions but one, and with 4 positions (the amplifiers) that is
    /// |R1| × |R2| × |R3|, about 10^8 on a 1 000-part reel, which the box test hardly prunes (their common-mode spec
    /// couples R1/R2 with R3/R4, and a box of ±1 % on R3, R4 lets every R1, R2 pass); the build did not finish within
    /// 5 min there (docs/planning.md). 4-position networks whose outputs depend on two position ratios (the
    /// amplifiers) are priced by <see cref="RatioPairPricing"/> instead.
    /// </summary>
    public const int MaxNetworkPositions = 3;

    /// <summary>Largest number of usable parts of a network recipe of at most
    /// <see cref="MaxNetworkPositions"/> positions the column bound runs on (<see cref="NetworkPricing"/>).
    /// </summary>
    public const int MaxNetworkParts = 1_500;

    /// <summary>Grid steps per match window of the pricing sweep (the family is widened by 1/GridSteps).</summary>
    public const int GridSteps = 32;

    /// <summary>
    /// Share of the time limit the column LP may take from the start of the assembly: 0.3, or 0.85 for a network recipe
    /// priced by <see cref="NetworkPricing"/> (above <see cref="EnumerateParts"/> parts), whose bound is proven only
    /// once the LP converges (the pricing's minimum stays 0 until then): on the 1 000-part divider reels it needs about
    /// 2–4.5 s after the sweep and the part filter (5.3 s plus a 1.3 s build at load 7), and with 0.5 the normal reel
    /// did not converge in the benchmark; with 0.7 it fell back to the part count under load. Once it converges, the
    /// exact cover over its sets (<see cref="Packing.PoolPacker"/>) reached the bound on both divider reels, so the
    /// neighbourhood search is needed only when it does not (docs/planning.md).
    /// </summary>
    public static double TimeShare(Recipe recipe, int usable) =>
        recipe.Form == RecipeForm.Network
        && usable > EnumerateParts
        && usable <= MaxNetworkParts
        && (recipe.Positions.Count <= MaxNetworkPositions || RatioPairPricing.Applies(recipe))
            ? 0.85
            : 0.3;

    /// <summary>The smaller of <paramref name="current"/> and the column bound, with its name, and the column
    /// LP's result with its pool of sets (null when it did not run or proved nothing).</summary>
    public static (int Bound, string Name, ColumnBoundResult? Lp) Tighten(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options,
        IReadOnlyList<(Option[] Fills, SetVerdict Verdict)> found,
        (int Bound, string Name) current,
        Func<bool> stop
    )
    {
        if (
            current.Bound <= found.Count
            || usable.Count == 0
            || (recipe.Form == RecipeForm.Matched && usable.Count > MaxMatchedParts)
            || (
                recipe.Form != RecipeForm.Matched
                && usable.Count > EnumerateParts
                && (
                    usable.Count > MaxNetworkParts
                    || (recipe.Positions.Count > MaxNetworkPositions && !RatioPairPricing.Applies(recipe))
                )
            )
            || stop()
        )
        {
            return (current.Bound, current.Name, null);
        }

        var result = Run(recipe, usable, options, found, stop);
        return result is not null && result.Bound < current.Bound
            ? (
                result.Bound,
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"column LP (set packing over {result.Family}; {result.Rounds} pricing round(s), "
                        + $"{result.Columns} columns{(result.Converged ? ", LP optimum" : ", stopped early")}; "
                        + $"LP duality with exact pricing); part count gave {current.Bound}"
                ),
                result
            )
            : (current.Bound, current.Name, result);
    }

    /// <summary>The column bound with its certificate, or null when none was proven in time.</summary>
    public static ColumnBoundResult? Run(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options,
        IReadOnlyList<(Option[] Fills, SetVerdict Verdict)> found,
        Func<bool> stop,
        int gridSteps = GridSteps,
        int enumerateParts = EnumerateParts
    )
    {
        ISetRule rule = recipe.Form == RecipeForm.Matched ? new MatchedRule(recipe) : new NetworkRule(recipe);
        IColumnPricing? pricing =
            usable.Count <= enumerateParts ? EnumeratedPricing.TryCreate(recipe, usable, rule, options) : null;
        pricing ??=
            recipe.Form == RecipeForm.Matched ? new MatchedPricing(recipe, usable, options, gridSteps)
            : RatioPairPricing.Applies(recipe) ? RatioPairPricing.TryCreate(recipe, usable, options, stop)
            : NetworkPricing.TryCreate(recipe, usable, options, stop);
        if (pricing is null)
        {
            return null;
        }

        var initial = found.Select(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray());
        if (pricing is RatioPairPricing)
        {
            // The full master stalls on these reels (every new column enters at level 0); duals per bin of parts.
            return BinnedColumnBound.Solve(pricing, usable, initial, stop);
        }

        if (pricing is MatchedPricing && usable.Count > MaxParts)
        {
            var (z, classOf) = Pooling(usable, options);
            return AggregatedColumnBound.Solve(pricing, z, classOf, new MatchedRule(recipe).Window, initial, stop);
        }

        // Network pricing at reel scale costs far more per round than the master: more columns per round, fewer rounds.
        return ColumnBoundSolver.Solve(pricing, usable.Count, initial, stop, pricing is NetworkPricing ? 600 : 200);
    }

    // Per part, z = ln(value / nominal) and the index of its nominal (parts of one nominal are pooled).
    internal static (double[] Z, int[] ClassOf) Pooling(IReadOnlyList<PartCandidate> usable, AssemblyOptions options)
    {
        var nominals = new List<double>();
        var classOf = new int[usable.Count];
        var z = new double[usable.Count];
        for (var i = 0; i < usable.Count; i++)
        {
            var c = nominals.FindIndex(n => options.SameNominal(usable[i].Nominal, n));
            if (c < 0)
            {
                c = nominals.Count;
                nominals.Add(usable[i].Nominal);
            }

            classOf[i] = c;
            z[i] = Math.Log(usable[i].Value.Value / usable[i].Nominal);
        }

        return (z, classOf);
    }
}
