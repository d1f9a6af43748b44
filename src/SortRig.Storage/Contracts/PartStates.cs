namespace SortRig.Storage.Contracts;

/// <summary>Where a measured part stands in its session. Stored as its name.</summary>
public enum PartState
{
    /// <summary>Committed with a settled value; not yet shown to the operator.</summary>
    Accepted = 0,

    /// <summary>Committed and its cup was announced to the operator.</summary>
    Announced = 1,

    /// <summary>Committed for the record but the reading never settled; not in any cup, not in the library.</summary>
    Unstable = 2,

    /// <summary>Withdrawn by the operator (wrong part, bad contact); kept for history.</summary>
    Undone = 3,

    /// <summary>Superseded by a later measurement of the same physical part.</summary>
    Remeasured = 4,

    /// <summary>Taken out of its cup before the session finished; kept for history, no longer counted in the
    /// cup.</summary>
    RemovedEarly = 5,
}

/// <summary>Library status of a measured part. Only Accepted/Announced parts take part in the library.</summary>
public enum LibraryStatus
{
    /// <summary>On the shelf, free to take.</summary>
    Available = 0,

    /// <summary>Reserved by someone (see PartRecord.TakenBy) for a build.</summary>
    Taken = 1,

    /// <summary>Fitted into a build.</summary>
    Used = 2,

    /// <summary>Out of service (damaged, drifted, lost).</summary>
    Retired = 3,
}
