namespace SortRig.Planning.Cups;

/// <summary>The ranges that every cup planner's options share, each checked in one place so that the planners'
/// options cannot drift apart: a bad value throws naming the parameter as the caller wrote it.</summary>
internal static class CupOptionRules
{
    /// <summary>Regular cups K: 1 to <see cref="CupLabels.MaxCups"/>.</summary>
    public static int CupCount(int cupCount) =>
        cupCount is >= 1 and <= CupLabels.MaxCups
            ? cupCount
            : throw new ArgumentOutOfRangeException(
                nameof(cupCount),
                cupCount,
                $"CupCount must be 1 to {CupLabels.MaxCups}"
            );

    /// <summary>Band width, ppm of nominal: 1 to 100 000.</summary>
    public static double MatchTolerancePpm(double matchTolerancePpm) =>
        matchTolerancePpm is >= 1 and <= 100_000
            ? matchTolerancePpm
            : throw new ArgumentOutOfRangeException(
                nameof(matchTolerancePpm),
                matchTolerancePpm,
                "MatchTolerancePpm must be 1 to 100 000"
            );

    /// <summary>Marked tolerance of the reel, percent: 0.001 to 50.</summary>
    public static double StockTolerancePercent(double stockTolerancePercent) =>
        stockTolerancePercent is >= 0.001 and <= 50
            ? stockTolerancePercent
            : throw new ArgumentOutOfRangeException(
                nameof(stockTolerancePercent),
                stockTolerancePercent,
                "StockTolerancePercent must be 0.001 to 50"
            );

    /// <summary>Largest expanded transfer uncertainty accepted, ppm: 0 to 100 000, default half the band
    /// width.</summary>
    public static double UncertaintyLimitPpm(double? uncertaintyLimitPpm, double matchTolerancePpm)
    {
        var limit = uncertaintyLimitPpm ?? (matchTolerancePpm / 2);
        return limit is >= 0 and <= 100_000
            ? limit
            : throw new ArgumentOutOfRangeException(
                nameof(uncertaintyLimitPpm),
                uncertaintyLimitPpm,
                "UncertaintyLimitPpm must be 0 to 100 000"
            );
    }
}
