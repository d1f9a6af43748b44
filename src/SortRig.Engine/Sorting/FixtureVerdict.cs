namespace SortRig.Engine.Sorting;

/// <summary>What the loop does about one reading before the settle rule sees it (<see cref="FixtureWatch"/>).</summary>
internal enum FixtureAction
{
    /// <summary>Nothing: the reading goes to the settle rule as it is.</summary>
    None,

    /// <summary>Readings were late (an outage, a slow host): that time does not count against the settle limit.</summary>
    Excuse,

    /// <summary>The readings stopped while the part settled: measure the part in the fixture again.</summary>
    Remeasure,

    /// <summary>Another part is in the fixture than the one decided: start measuring it as a new part.</summary>
    NewPart,
}

/// <summary>The fixture watch's verdict on one reading.</summary>
/// <param name="Action">What to do.</param>
/// <param name="Excused">Time to excuse (for <see cref="FixtureAction.Excuse"/>).</param>
/// <param name="Message">What to tell the operator (for <see cref="FixtureAction.Remeasure"/> and <see cref="FixtureAction.NewPart"/>).</param>
internal readonly record struct FixtureVerdict(FixtureAction Action, TimeSpan Excused = default, string? Message = null);
