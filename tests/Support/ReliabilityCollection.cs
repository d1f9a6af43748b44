namespace SortRig.Tests.Support;

/// <summary>
/// The reliability tests run one at a time: each loads the 2-core machine on its own, and those on a scaled wall clock
/// (trait <see cref="Clock"/> = <see cref="Wall"/>) must not share it: scripts/test runs them after the other tests.
/// </summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ReliabilityCollection
{
    public const string Name = "reliability";

    /// <summary>Trait name saying which clock a test runs on.</summary>
    public const string Clock = "Clock";

    /// <summary>Trait value of a test on a scaled wall clock (a stall of the machine is minutes of bench
    /// time).</summary>
    public const string Wall = "Wall";
}
