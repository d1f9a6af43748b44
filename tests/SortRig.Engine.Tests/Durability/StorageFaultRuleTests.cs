using SortRig.Engine.Durability;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Tests.Durability;

/// <summary>The one durable-write rule sorting and drift share (common practice, no source: wait for what
/// clears).</summary>
public sealed class StorageFaultRuleTests
{
    [Theory]
    [InlineData(StorageFault.Locked, true, true)]
    [InlineData(StorageFault.Unavailable, true, true)]
    [InlineData(StorageFault.ReadOnly, true, false)]
    [InlineData(StorageFault.DiskFull, true, false)]
    [InlineData(StorageFault.Other, true, false)]
    [InlineData(StorageFault.Corrupt, false, false)]
    [InlineData(StorageFault.Constraint, false, false)]
    [InlineData(StorageFault.Conflict, false, false)]
    public void Fault_SortingWaitsForWhatAPersonCanClear_DriftRetriesOnlyWhatClearsByItself(
        StorageFault fault,
        bool sortingWaits,
        bool driftRetries
    )
    {
        Assert.Equal(sortingWaits, StorageFaultRule.OperatorCanClear(fault));
        Assert.Equal(driftRetries, StorageFaultRule.ClearsByItself(fault));
    }

    [Fact]
    public void EveryFault_HasAnActionAndPlainWords()
    {
        foreach (var fault in Enum.GetValues<StorageFault>())
        {
            Assert.True(Enum.IsDefined(StorageFaultRule.For(fault)));
            Assert.StartsWith("the ", StorageFaultRule.Plain(fault), StringComparison.Ordinal);
        }
    }
}
