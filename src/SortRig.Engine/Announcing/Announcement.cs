namespace SortRig.Engine.Announcing;

/// <summary>One thing said to the operator.</summary>
/// <param name="Kind">What to do.</param>
/// <param name="PartNumber">Part number in the session; 0 for Info.</param>
/// <param name="Label">Cup or slot label ("C", "R", "T1-A07"); empty for Info.</param>
/// <param name="Ohms">Accepted value in ohms; NaN when none.</param>
/// <param name="DeviationPpm">Deviation from nominal in ppm; NaN when none.</param>
/// <param name="Text">A short plain sentence.</param>
/// <param name="CompletesSet">True when this part completes a set in its cup.</param>
public sealed record Announcement(
    AnnouncementKind Kind,
    long PartNumber,
    string Label,
    double Ohms,
    double DeviationPpm,
    string Text,
    bool CompletesSet = false
)
{
    /// <summary>An information-only announcement.</summary>
    public static Announcement Info(string text) => new(AnnouncementKind.Info, 0, "", double.NaN, double.NaN, text);
}
