using SortRig.Simulator;

namespace SortRig.Engine.Simulation;

/// <summary>
/// Test hooks for the embedded simulator of a sorting run (fault soaks, serial links). Not part of
/// the product: the sort verb never sets them. Every member is optional; none changes behaviour
/// when null.
/// </summary>
internal sealed record SimulatorHooks
{
    /// <summary>Adjusts the bench options built from the sort options (fault rates, operator patience).</summary>
    public Func<SimulatedBenchOptions, SimulatedBenchOptions>? Configure { get; init; }

    /// <summary>The virtual operator's clock (<see cref="VirtualClock.OperatorView"/>); null: the session's
    /// clock.</summary>
    public TimeProvider? OperatorTime { get; init; }

    /// <summary>Called with the bench once it serves (tests read its truth and fault log).</summary>
    public Action<SimulatedBench>? Started { get; init; }

    /// <summary>
    /// Serves the bench and returns the meter resource to connect to (e.g. a serial pseudo-terminal
    /// as <c>ASRL::/tmp/x::INSTR</c>); null serves TCP on a free loopback port.
    /// </summary>
    public Func<SimulatedBench, CancellationToken, Task<string>>? Serve { get; init; }
}
