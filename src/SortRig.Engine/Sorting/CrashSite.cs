namespace SortRig.Engine.Sorting;

/// <summary>The points of the sorting loop where the crash tests may kill the process (<see
/// cref="CrashPoint"/>).</summary>
internal enum CrashSite
{
    /// <summary>A part settled and checked, not yet committed.</summary>
    Read,

    /// <summary>Committed, not yet announced.</summary>
    Commit,

    /// <summary>Announced, not yet marked announced in the log.</summary>
    Announce,

    /// <summary>A range transfer's bridging part read on both ranges, the correction not yet recorded.</summary>
    Bridge,

    /// <summary>The correction recorded, not yet announced.</summary>
    Bridged,

    /// <summary>The check standard read and judged, its record not yet written.</summary>
    Check,

    /// <summary>The check's record written (with any flags), not yet shown or acted on.</summary>
    Checked,
}
