namespace SortRig.Measurement.Control;

/// <summary>Which test put a point out of control.</summary>
public enum ControlRule
{
    /// <summary>No test fired: the point is in control.</summary>
    None = 0,

    /// <summary>Western Electric rule 1: one point beyond the 3-sigma limits.</summary>
    BeyondThreeSigma = 1,

    /// <summary>Western Electric rule 2: two of the last three points beyond 2 sigma on the same side.</summary>
    TwoOfThreeBeyondTwoSigma = 2,

    /// <summary>Western Electric rule 4: eight points in a row on the same side of the centre.</summary>
    EightOnOneSide = 4,

    /// <summary>The moving range to the previous point is above D4 · MR-bar.</summary>
    MovingRangeAboveLimit = 10,

    /// <summary>The EWMA statistic is outside its exact time-varying limits (slow drift).</summary>
    EwmaBeyondLimits = 11,
}
