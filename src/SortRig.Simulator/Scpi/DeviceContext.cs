using SortRig.Simulator.Faults;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Scpi;

/// <summary>Everything a command handler can reach: the meter, the bench physics and the test side channel.</summary>
internal sealed class DeviceContext
{
    public required string Identity { get; init; }

    public required BenchEnvironment Environment { get; init; }

    public required MeterState State { get; init; }

    public required ErrorQueue Errors { get; init; }

    public required StatusRegisters Status { get; init; }

    public required MeasurementEngine Engine { get; init; }

    public required Acquisition Acquisition { get; init; }

    public required Fixture Fixture { get; init; }

    public required Scanner Scanner { get; init; }

    public required IReadOnlyList<SimulatedPart> Reel { get; init; }

    public required VirtualOperator Operator { get; init; }

    public required FaultInjector Faults { get; init; }

    /// <summary>Cancelled when the bench is disposed; background acquisitions are linked to it.</summary>
    public required CancellationToken Lifetime { get; init; }

    public void PushError(ScpiError error)
    {
        Errors.Push(error);
        Status.Record(error);
    }

    /// <summary>*RST: abort any acquisition and restore the default configuration (status and error queue
    /// stay).</summary>
    public void Reset()
    {
        Acquisition.Abort();
        State.Reset();
    }
}
