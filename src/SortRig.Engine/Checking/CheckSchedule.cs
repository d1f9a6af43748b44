namespace SortRig.Engine.Checking;

/// <summary>When the check is due between parts: every N parts and/or every M minutes (whichever comes
/// first).</summary>
/// <param name="EveryParts">Parts between checks; 0 for no count.</param>
/// <param name="Every">Time between checks; zero for no clock.</param>
public sealed record CheckSchedule(int EveryParts, TimeSpan Every)
{
    /// <summary>True when a check is due: at least one part since the last check and either limit reached.</summary>
    /// <param name="partsSinceLast">Parts recorded since the last check.</param>
    /// <param name="sinceLast">Time since the last check.</param>
    public bool Due(int partsSinceLast, TimeSpan sinceLast) =>
        partsSinceLast > 0
        && ((EveryParts > 0 && partsSinceLast >= EveryParts) || (Every > TimeSpan.Zero && sinceLast >= Every));
}
