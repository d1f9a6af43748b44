namespace SortRig.Engine.Events;

/// <summary>Kinds of event the bench publishes to the console view, the web page and the JSON API.</summary>
public enum BenchEventKind
{
    /// <summary>A live reading and the settle state of the part in the fixture.</summary>
    Reading,

    /// <summary>A part was committed and its cup is announced.</summary>
    Announcement,

    /// <summary>Cup counts changed.</summary>
    Counts,

    /// <summary>Something the operator must know (reconnect, pause, storage fault).</summary>
    Notice,

    /// <summary>The session ended.</summary>
    Finished,

    /// <summary>A drift sample was logged.</summary>
    Drift,
}
