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
