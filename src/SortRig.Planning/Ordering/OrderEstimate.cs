namespace SortRig.Planning.Ordering;

/// <summary>What to buy of one nominal at one confidence level.</summary>
/// <param name="Nominal">Nominal, ohms.</param>
/// <param name="PerSet">Parts of this nominal one set takes (every position one part).</param>
/// <param name="Quantity">Parts to buy.</param>
/// <param name="ExpectedLeftover">Mean over trials of the parts bought that are in none of the first N sets
/// built.</param>
/// <param name="Cost">Cost of <paramref name="Quantity"/> parts; null when no prices were given for this
/// nominal.</param>
/// <param name="CheaperQuantity">A larger quantity at a higher break that costs less in total, or null.</param>
/// <param name="CheaperCost">Cost of <paramref name="CheaperQuantity"/>, or null.</param>
public sealed record OrderLine(
    double Nominal,
    int PerSet,
    int Quantity,
    double ExpectedLeftover,
    double? Cost,
    int? CheaperQuantity,
    double? CheaperCost
);

/// <summary>The order at one confidence level.</summary>
/// <param name="Confidence">0.90, 0.95 or 0.99.</param>
/// <param name="SetEquivalents">Sets' worth of parts to buy (quantity of each nominal = this × parts per set); null
/// when more than the part cap would be needed.</param>
/// <param name="Reached">Fraction of trials that made the sets wanted from this order.</param>
/// <param name="Lines">One line per nominal; empty when <paramref name="SetEquivalents"/> is null.</param>
/// <param name="Trimmed">True when the quantities were trimmed per nominal after the joint answer
/// (<see cref="OrderOptions.PerNominal"/>); <paramref name="Reached"/> is then that of the trimmed order.</param>
public sealed record OrderLevel(
    double Confidence,
    int? SetEquivalents,
    double Reached,
    IReadOnlyList<OrderLine> Lines,
    bool Trimmed = false
)
{
    /// <summary>Parts in the order.</summary>
    public int TotalParts => Lines.Sum(l => l.Quantity);

    /// <summary>Cost of the order (best of each line's own quantity and a cheaper larger break); null unless every line
    /// has prices.</summary>
    public double? TotalCost =>
        Lines.Count > 0 && Lines.All(l => l.Cost is not null)
            ? Lines.Sum(l => Math.Min(l.Cost!.Value, l.CheaperCost ?? double.MaxValue))
            : null;
}

/// <summary>Sets made from one order size, over the trials.</summary>
/// <param name="SetEquivalents">Sets' worth of parts bought.</param>
/// <param name="PartsBought">Parts bought in all.</param>
/// <param name="MeanSets">Mean sets made.</param>
/// <param name="Low">5 % quantile of the sets made.</param>
/// <param name="Median">Median sets made.</param>
/// <param name="High">95 % quantile of the sets made.</param>
public sealed record OrderCurvePoint(
    int SetEquivalents,
    int PartsBought,
    double MeanSets,
    int Low,
    int Median,
    int High
);

/// <summary>The result of an order estimate.</summary>
/// <param name="RecipeName">Recipe name.</param>
/// <param name="SetsWanted">Sets wanted.</param>
/// <param name="PartsPerSet">Parts one set takes when every position is one part.</param>
/// <param name="Stock">The stock distribution, in words.</param>
/// <param name="TransferUncertainty">Expanded transfer uncertainty used, relative.</param>
/// <param name="Trials">Trials run.</param>
/// <param name="Seed">Seed.</param>
/// <param name="NotReached">Trials that could not make the sets within the part cap.</param>
/// <param name="Levels">The order at 90, 95 and 99 %.</param>
/// <param name="Curve">Sets made against parts bought (mean, 5 %, median, 95 %).</param>
/// <param name="MeanSetEquivalents">Mean over the trials that reached of the smallest order (sets' worth) that made the
/// sets.</param>
/// <param name="Elapsed">Wall time.</param>
public sealed record OrderEstimate(
    string RecipeName,
    int SetsWanted,
    int PartsPerSet,
    string Stock,
    double TransferUncertainty,
    int Trials,
    int Seed,
    int NotReached,
    IReadOnlyList<OrderLevel> Levels,
    IReadOnlyList<OrderCurvePoint> Curve,
    double MeanSetEquivalents,
    TimeSpan Elapsed
);
