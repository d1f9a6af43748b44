using SortRig.Planning.Recipes;

namespace SortRig.Planning.Cups;

/// <summary>Options of <see cref="AdaptiveCupPlanner"/>. Validated at construction.</summary>
public sealed record AdaptiveCupOptions
{
    /// <summary>Creates validated options.</summary>
    /// <param name="cupCount">Regular cups K per nominal, 1 to 23 (plus the reject cup "R").</param>
    /// <param name="matchTolerancePpm">Largest band width, ppm of nominal, 1 to 100 000.</param>
    /// <param name="stockTolerancePercent">Marked tolerance of the reels, percent, 0.001 to 50.</param>
    /// <param name="partsPerSet">Parts of each nominal (ohms) one set needs, 1 to 100 each; at least one
    /// nominal.</param>
    /// <param name="learnCount">Parts of a nominal while the empty cups' bands are placed again at every part (after
    /// that, each time the sample grows by a tenth); also the weight of the mirrored parts early on. 4 to 10 000,
    /// default 40.</param>
    /// <param name="uncertaintyLimitPpm">Largest expanded transfer uncertainty accepted, ppm; default half the match
    /// tolerance.</param>
    /// <param name="followParts">When true, the band of a cup that holds parts is placed again with the empty cups'
    /// bands, anywhere that still holds every part of the cup (<see cref="FollowParts"/>); default true (false: today's
    /// fixed bands).</param>
    public AdaptiveCupOptions(
        int cupCount,
        double matchTolerancePpm,
        double stockTolerancePercent,
        IReadOnlyDictionary<double, int> partsPerSet,
        int learnCount = 40,
        double? uncertaintyLimitPpm = null,
        bool followParts = true
    )
    {
        FollowParts = followParts;
        CupCount = CupOptionRules.CupCount(cupCount);
        MatchTolerancePpm = CupOptionRules.MatchTolerancePpm(matchTolerancePpm);
        StockTolerancePercent = CupOptionRules.StockTolerancePercent(stockTolerancePercent);
        PartsPerSet =
            partsPerSet.Count > 0 && partsPerSet.All(kv => kv.Key > 0 && kv.Value is >= 1 and <= 100)
                ? new Dictionary<double, int>(partsPerSet)
                : throw new ArgumentOutOfRangeException(
                    nameof(partsPerSet),
                    "PartsPerSet needs at least one nominal > 0 ohms with 1 to 100 parts"
                );
        LearnCount = learnCount is >= 4 and <= 10_000
            ? learnCount
            : throw new ArgumentOutOfRangeException(nameof(learnCount), learnCount, "LearnCount must be 4 to 10 000");
        UncertaintyLimitPpm = CupOptionRules.UncertaintyLimitPpm(uncertaintyLimitPpm, matchTolerancePpm);
    }

    /// <summary>Regular cups per nominal (1–23).</summary>
    public int CupCount { get; }

    /// <summary>Largest band width, ppm.</summary>
    public double MatchTolerancePpm { get; }

    /// <summary>Reel tolerance, percent.</summary>
    public double StockTolerancePercent { get; }

    /// <summary>Parts of each nominal per set.</summary>
    public IReadOnlyDictionary<double, int> PartsPerSet { get; }

    /// <summary>Parts per nominal while the empty cups' bands are placed again at every part (default 40).</summary>
    public int LearnCount { get; }

    /// <summary>Largest expanded transfer uncertainty accepted, ppm.</summary>
    public double UncertaintyLimitPpm { get; }

    /// <summary>
    /// When true, a band that holds parts is not fixed: at every plan it may move to any lattice place whose band still
    /// holds the whole uncertainty interval of every part in its cup (the hull of the cup's parts), so the cup's parts
    /// stay a matched set in the worst case while its band follows the learned distribution; and a cup may take a part
    /// up to the part's own interval (2U) across its band's edge when the hull with the part still fits one band, the
    /// band moving to hold it. Not used when the K bands tile the whole stock tolerance (nothing to choose).
    /// </summary>
    public bool FollowParts { get; }

    /// <summary>Options for a matched-form recipe: its match tolerance and its single-part demand per
    /// nominal.</summary>
    /// <exception cref="ArgumentException">The recipe is not in the matched form.</exception>
    public static AdaptiveCupOptions ForRecipe(
        Recipe recipe,
        int cupCount,
        double stockTolerancePercent,
        int learnCount = 40,
        bool followParts = true
    ) =>
        recipe.Form == RecipeForm.Matched
            ? new AdaptiveCupOptions(
                cupCount,
                recipe.MatchTolerancePpm,
                stockTolerancePercent,
                recipe.SinglePartDemand,
                learnCount,
                followParts: followParts
            )
            : throw new ArgumentException("cup bands need a matched-form recipe (a ratio tolerance)", nameof(recipe));
}
