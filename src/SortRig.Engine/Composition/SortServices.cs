using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Simulation;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;
using SortRig.Planning.Cups;
using SortRig.Simulator;
using SortRig.Storage;

namespace SortRig.Engine.Composition;

/// <summary>Shared services of one sorting run, owned by whoever hosts it (the sort verb or a test).</summary>
/// <param name="Time">The clock; for the embedded simulator the same scaled clock drives both sides.</param>
/// <param name="Hub">Event stream.</param>
/// <param name="Snapshot">State for the page and API.</param>
/// <param name="Commands">Operator actions.</param>
/// <param name="Announcer">Where announcements go besides the event stream.</param>
/// <param name="Loggers">Logging.</param>
public sealed record SortServices(
    TimeProvider Time,
    BenchEventHub Hub,
    BenchSnapshot Snapshot,
    OperatorCommands Commands,
    IAnnouncer Announcer,
    ILoggerFactory Loggers
)
{
    /// <summary>Clock of link timeouts (connect, write, reply); null: <see cref="Time"/>. A session on a
    /// <see cref="VirtualClock"/> gives the system clock here, so that virtual time never times out real socket
    /// I/O.</summary>
    public TimeProvider? LinkTime { get; init; }
}
