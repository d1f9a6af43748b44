namespace SortRig.Engine.Announcing;

/// <summary>What an announcement tells the operator to do.</summary>
public enum AnnouncementKind
{
    /// <summary>Put the part in the named cup or slot.</summary>
    Cup,

    /// <summary>Put the part in the reject cup.</summary>
    Reject,

    /// <summary>The part would not settle: reseat it or set it aside.</summary>
    Unstable,

    /// <summary>A cup announced before a restart, said again.</summary>
    Repeat,

    /// <summary>Plain information (pause, reconnect, finish).</summary>
    Info,
}

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
    bool CompletesSet = false)
{
    /// <summary>An information-only announcement.</summary>
    public static Announcement Info(string text) => new(AnnouncementKind.Info, 0, "", double.NaN, double.NaN, text);
}
