namespace SortRig.Engine.Operator;

/// <summary>Actions an operator takes with a single key or a button on the page.</summary>
public enum OperatorCommand
{
    /// <summary>The last part went into the wrong cup: take back its announcement (key U).</summary>
    UndoLast,

    /// <summary>Discard the current settle and measure the part in the fixture again (key M).</summary>
    Remeasure,

    /// <summary>Pause or resume measuring (key P or space).</summary>
    TogglePause,

    /// <summary>End the session after the current part (key F).</summary>
    Finish,

    /// <summary>After a check out of control: re-reference to the check and measure the flagged parts again (key
    /// R).</summary>
    RemeasureFlagged,
}
