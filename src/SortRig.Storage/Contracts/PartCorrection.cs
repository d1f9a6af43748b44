namespace SortRig.Storage.Contracts;

/// <summary>What an operator correction does to a committed part.</summary>
public enum PartCorrectionKind
{
    /// <summary>Withdraw the part (state Undone).</summary>
    Undo = 0,

    /// <summary>The part was put in another cup than announced: change its cup label, keep its state.</summary>
    MoveToCup = 1,

    /// <summary>The part is measured again; this record becomes Remeasured.</summary>
    Remeasure = 2,

    /// <summary>The part left its cup before the session finished (state RemovedEarly).</summary>
    RemoveEarly = 3,
}

/// <summary>An operator correction; the old values are kept in the part history.</summary>
/// <param name="PartId">Part to correct.</param>
/// <param name="Kind">What to do.</param>
/// <param name="NewCupLabel">Required for MoveToCup (non-empty), ignored otherwise.</param>
/// <param name="Note">Why, optional.</param>
public sealed record PartCorrection(
    long PartId,
    PartCorrectionKind Kind,
    string? NewCupLabel = null,
    string? Note = null
);

/// <summary>Kind of a part history entry.</summary>
public enum PartEventKind
{
    /// <summary>Undo correction.</summary>
    Undone = 0,

    /// <summary>Cup label corrected.</summary>
    CupCorrected = 1,

    /// <summary>Marked remeasured.</summary>
    Remeasured = 2,

    /// <summary>Removed early from its cup.</summary>
    RemovedEarly = 3,

    /// <summary>Taken from the library.</summary>
    Taken = 4,

    /// <summary>Given back to the library.</summary>
    Released = 5,

    /// <summary>Fitted into a build.</summary>
    Used = 6,

    /// <summary>Retired from the library.</summary>
    Retired = 7,

    /// <summary>Storage location changed.</summary>
    Relocated = 8,
}

/// <summary>One entry of a part's history, oldest first.</summary>
/// <param name="Id">Entry id, increasing.</param>
/// <param name="PartId">The part.</param>
/// <param name="At">When (UTC, from the log's TimeProvider).</param>
/// <param name="Kind">What happened.</param>
/// <param name="Before">State, cup label, library status and location before, as text (e.g. "Accepted"); null when
/// unchanged.</param>
/// <param name="After">The same after.</param>
/// <param name="Actor">Who, when known (the taker for library moves).</param>
/// <param name="Note">Free text, optional.</param>
public sealed record PartEvent(
    long Id,
    long PartId,
    DateTimeOffset At,
    PartEventKind Kind,
    string? Before,
    string? After,
    string? Actor,
    string? Note
);
