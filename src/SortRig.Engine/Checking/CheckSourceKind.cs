namespace SortRig.Engine.Checking;

/// <summary>Where the session's check standard comes from.</summary>
public enum CheckSourceKind
{
    /// <summary>A reference part the operator keeps beside the fixture and puts in when asked.</summary>
    Fixture = 0,

    /// <summary>A part of the library (its logged value is the calibrated value); the operator puts it in when
    /// asked.</summary>
    Library = 1,
}
