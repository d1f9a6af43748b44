namespace SortRig.Tests.Support;

/// <summary>The reliability tests run one at a time: each loads the 2-core machine on its own.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ReliabilityCollection
{
    public const string Name = "reliability";
}
