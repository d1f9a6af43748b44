using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Building;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Instruments.Drivers;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

/// <summary>Everything a sorting loop works with, assembled by the sort verb or a test.</summary>
/// <param name="Plan">Range, NPLC and settle options of the batch.</param>
/// <param name="ConnectAsync">Opens a fresh, configured-or-not meter connection (called again after a fault).</param>
/// <param name="Log">The precision log.</param>
/// <param name="Cups">Chooses a cup for each accepted part.</param>
/// <param name="Announcer">Tells the operator.</param>
/// <param name="Hub">The bench event stream.</param>
/// <param name="Snapshot">State for the page and the API.</param>
/// <param name="Commands">Operator actions.</param>
/// <param name="Hands">The hands at the fixture (a person, or the simulator's virtual operator).</param>
/// <param name="Time">The clock (scaled on the simulator, virtual in tests).</param>
/// <param name="Logger">Diagnostics.</param>
public sealed record SortContext(
    SortPlan Plan,
    Func<CancellationToken, Task<IResistanceMeter>> ConnectAsync,
    IPrecisionLog Log,
    ICupAssigner Cups,
    IAnnouncer Announcer,
    BenchEventHub Hub,
    BenchSnapshot Snapshot,
    OperatorCommands Commands,
    IFixtureHands Hands,
    TimeProvider Time,
    ILogger Logger
)
{
    /// <summary>The build the session sorts toward (a recipe and a number of sets); null to sort the whole
    /// reel.</summary>
    public BuildTarget? Build { get; init; }
}
