namespace SortRig.Planning.Cups;

/// <summary>The ranges that every cup planner's options share, each checked in one place so that the planners'
/// options cannot drift apart: a bad value throws naming the parameter as the caller wrote it.</summary>
internal static class CupOptionRules
{
    /// <summary>Regular cups K: 1 to <see cref="CupLabels.MaxCups"/>.</summary>
    public static int CupCount(int cupCount) =>
        InRange(cupCount, 1, CupLabels.MaxCups, nameof(cupCount), $"1 to {CupLabels.MaxCups}");

    /// <summary>Band width, ppm of nominal: 1 to 100 000.</summary>
    public static double MatchTolerancePpm(double matchTolerancePpm) =>
        InRange(matchTolerancePpm, 1, 100_000, nameof(matchTolerancePpm), "1 to 100 000");

    /// <summary>Marked tolerance of the reel, percent: 0.001 to 50.</summary>
    public static double StockTolerancePercent(double stockTolerancePercent) =>
        InRange(stockTolerancePercent, 0.001, 50, nameof(stockTolerancePercent), "0.001 to 50");

    /// <summary>Largest expanded transfer uncertainty accepted, ppm: 0 to 100 000, default half the band
    /// width.</summary>
    public static double UncertaintyLimitPpm(double? uncertaintyLimitPpm, double matchTolerancePpm) =>
        InRange(
            uncertaintyLimitPpm ?? (matchTolerancePpm / 2),
            0,
            100_000,
            nameof(uncertaintyLimitPpm),
            "0 to 100 000"
        );

    /// <summary>The value when it lies in [min, max] (NaN does not), else the exception naming the parameter and the
    /// range as the message says it ("CupCount must be 1 to 8").</summary>
    private static T InRange<T>(T value, T min, T max, string parameter, string range)
        where T : IComparable<T> =>
        value.CompareTo(min) >= 0 && value.CompareTo(max) <= 0
            ? value
            : throw new ArgumentOutOfRangeException(
                parameter,
                value,
                $"{char.ToUpperInvariant(parameter[0])}{parameter[1..]} must be {range}"
            );
}
