namespace SortRig.Measurement.Settling;

/// <summary>Where the settle rule is with the part in the fixture.</summary>
public enum SettleState
{
    /// <summary>No part: the meter reads overload. Waiting for an insertion.</summary>
    Empty = 0,

    /// <summary>A part has just touched the contacts; readings are ignored for the bounce time.</summary>
    Bouncing = 1,

    /// <summary>Collecting readings until the window is stable.</summary>
    Settling = 2,

    /// <summary>The window is stable; the verdict carries the measured value. Then AwaitingRemoval.</summary>
    Accepted = 3,

    /// <summary>The maximum settle time passed without stability; the verdict says why. Then AwaitingRemoval.</summary>
    Unstable = 4,

    /// <summary>A verdict was given; further readings are ignored until the part is removed.</summary>
    AwaitingRemoval = 5,

    /// <summary>The part was removed (consecutive overloads). The tracker is Empty again.</summary>
    Removed = 6,
}

/// <summary>Why a part was declared unstable.</summary>
public enum UnstableReason
{
    /// <summary>The regression slope over the window stayed significant or too large.</summary>
    DriftingSlope = 0,

    /// <summary>The slope was acceptable but the standard error of the mean stayed above the target.</summary>
    NoisySem = 1,

    /// <summary>Overload flickers interrupted the readings (poor contact).</summary>
    IntermittentContact = 2,

    /// <summary>Too few readings arrived within the maximum settle time to fill a window.</summary>
    TooFewReadings = 3,
}
