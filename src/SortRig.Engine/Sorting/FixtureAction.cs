namespace SortRig.Engine.Sorting;

/// <summary>What the loop does about one reading before the settle rule sees it (<see cref="FixtureWatch"/>).</summary>
internal enum FixtureAction
{
    /// <summary>Nothing: the reading goes to the settle rule as it is.</summary>
    None,

    /// <summary>Readings were late (an outage, a slow host): that time does not count against the settle
    /// limit.</summary>
    Excuse,

    /// <summary>The readings stopped while the part settled: measure the part in the fixture again.</summary>
    Remeasure,

    /// <summary>Another part is in the fixture than the one decided: start measuring it as a new part.</summary>
    NewPart,
}
