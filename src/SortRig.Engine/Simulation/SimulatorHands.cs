using SortRig.Engine.Sorting;
using SortRig.Simulator;
using SortRig.Simulator.Operator;

namespace SortRig.Engine.Simulation;

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
    public void Ready()
    {
        // An operator told to wait for the cue starts now; a manual one is driven by its test.
        if (bench.Options.Operator.Mode == OperatorMode.OnCue && !_stoppedForBridge)
        {
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

    /// <inheritdoc />
    public async Task PlaceCheckPartAsync(double nominal, CancellationToken ct)
    {
        _stoppedForBridge = true;
        await bench.Operator.HandInAsync(bench.CheckPart(nominal), ct).ConfigureAwait(false);
    }

    /// <inheritdoc />
    public async Task PlacePartAgainAsync(int reelPosition, CancellationToken ct)
    {
        _stoppedForBridge = true;
        await bench.Operator.HandInAsync(bench.Reel[reelPosition], ct).ConfigureAwait(false);
    }
}
