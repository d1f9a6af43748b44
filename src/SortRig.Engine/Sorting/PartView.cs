namespace SortRig.Engine.Sorting;

/// <summary>One part as the page and the JSON API show it.</summary>
/// <param name="Number">Part number within the session.</param>
/// <param name="Nominal">Nominal value of its batch, ohms.</param>
/// <param name="Ohms">Accepted value, ohms.</param>
/// <param name="DeviationPpm">Deviation from nominal, ppm.</param>
/// <param name="ExpandedUncertainty">Expanded transfer uncertainty of the value, ohms.</param>
/// <param name="Cup">Cup or slot label; null when the part went nowhere.</param>
/// <param name="State">Session state of the part (Accepted, Announced, Unstable ...).</param>
/// <param name="Time">When the value was accepted (UTC).</param>
/// <param name="AcceptedBy">The settle rule that accepted the part ("Averaging" or "Predictive"); null for unstable
/// parts and parts logged before the precision log recorded it.</param>
public sealed record PartView(
    long Number,
    double Nominal,
    double? Ohms,
    double? DeviationPpm,
    double? ExpandedUncertainty,
    string? Cup,
    string State,
    DateTimeOffset Time,
    string? AcceptedBy = null
);
