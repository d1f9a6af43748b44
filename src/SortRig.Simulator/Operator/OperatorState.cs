namespace SortRig.Simulator.Operator;

/// <summary>What the virtual operator is doing.</summary>
public enum OperatorState
{
    /// <summary>Not running (manual mode, or stopped).</summary>
    Idle = 0,

    /// <summary>Picking the next part off the reel and holding it (warming it).</summary>
    Handling = 1,

    /// <summary>A part is in the fixture; waiting for the announcement or the maximum dwell.</summary>
    Inserted = 2,

    /// <summary>The part is out; pausing before the next.</summary>
    Reacting = 3,

    /// <summary>The reel is used up; the fixture stays empty.</summary>
    Finished = 4,
}
