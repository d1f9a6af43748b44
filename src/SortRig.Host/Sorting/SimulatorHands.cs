using SortRig.Simulator;

namespace SortRig.Host.Sorting;

/// <summary>The embedded simulator's virtual operator as the hands at the fixture.</summary>
public sealed class SimulatorHands(SimulatedBench bench) : IFixtureHands
{
    private bool _stoppedForBridge;

    /// <inheritdoc />
    public void PartAnnounced() => bench.Operator.OnPartAnnounced();

    /// <inheritdoc />
    public void ResumeAt(int partsRecorded)
    {
        bench.Operator.SkipTo(partsRecorded);
        if (_stoppedForBridge)
        {
            // Feeding stopped for the bridging part: start again at the index just set.
            _stoppedForBridge = false;
            bench.Operator.Start();
        }
    }

    /// <inheritdoc />
    public async Task PlaceBridgingPartAsync(double nominal, CancellationToken ct)
    {
        _stoppedForBridge = true;
        await bench.Operator.HandInAsync(bench.TakeLoosePart(nominal), ct).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public void RemoveBridgingPart() => bench.Operator.TakeOut();
}
