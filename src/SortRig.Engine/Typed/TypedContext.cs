using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Typed;

/// <summary>Everything the typed sorting loop works with, assembled by <see cref="TypedRunner"/> or a test.</summary>
/// <param name="Options">The sort verb's settings (nominal, tolerances, session, parts).</param>
/// <param name="Meter">The typed-meter profile.</param>
/// <param name="Settle">The settle rule for people.</param>
/// <param name="Entries">Lines the operator types, and the prompt.</param>
/// <param name="Log">The precision log.</param>
/// <param name="Cups">Chooses a cup for each accepted part.</param>
/// <param name="Announcer">Tells the operator.</param>
/// <param name="Hub">The bench event stream.</param>
/// <param name="Snapshot">State for the page and the API.</param>
/// <param name="Time">Stamps each entry.</param>
/// <param name="Logger">Diagnostics.</param>
internal sealed record TypedContext(
    SortOptions Options,
    DisplayMeterSpec Meter,
    HandSettleOptions Settle,
    TypedEntries Entries,
    IPrecisionLog Log,
    ICupAssigner Cups,
    IAnnouncer Announcer,
    BenchEventHub Hub,
    BenchSnapshot Snapshot,
    TimeProvider Time,
    ILogger Logger
);
