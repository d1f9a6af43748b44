namespace SortRig.Engine.Sorting;

/// <summary>One part as the page and the JSON API show it.</summary>
public sealed record PartView(
    long Number,
    double Nominal,
    double? Ohms,
    double? DeviationPpm,
    double? ExpandedUncertainty,
    string? Cup,
    string State,
    DateTimeOffset Time);
