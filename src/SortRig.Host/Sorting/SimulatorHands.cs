using SortRig.Simulator.Operator;

namespace SortRig.Host.Sorting;

/// <summary>The embedded simulator's virtual operator as the hands at the fixture.</summary>
public sealed class SimulatorHands(VirtualOperator virtualOperator) : IFixtureHands
{
    /// <inheritdoc />
    public void PartAnnounced() => virtualOperator.OnPartAnnounced();

    /// <inheritdoc />
    public void ResumeAt(int partsRecorded) => virtualOperator.SkipTo(partsRecorded);
}
