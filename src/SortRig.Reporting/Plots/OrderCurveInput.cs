namespace SortRig.Reporting.Plots;

/// <summary>What the order plot draws: sets made against parts bought, over Monte Carlo trials.</summary>
/// <param name="RecipeName">Recipe name, for the title.</param>
/// <param name="SetsWanted">Sets wanted (a horizontal line).</param>
/// <param name="PartsBought">Parts bought per point, rising.</param>
/// <param name="Median">Median sets made per point.</param>
/// <param name="Low">5 % quantile of the sets made per point.</param>
/// <param name="High">95 % quantile of the sets made per point.</param>
/// <param name="Orders">Parts to buy at each confidence (e.g. "95 %" → 56), drawn as vertical lines.</param>
public sealed record OrderCurveInput(
    string RecipeName,
    int SetsWanted,
    IReadOnlyList<double> PartsBought,
    IReadOnlyList<double> Median,
    IReadOnlyList<double> Low,
    IReadOnlyList<double> High,
    IReadOnlyList<(string Label, double Parts)> Orders
);
