using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Engine.Building;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Instruments.Drivers;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

/// <summary>How a session ended.</summary>
/// <param name="SessionId">The session in the precision log.</param>
/// <param name="PartsRecorded">Parts in the session (any state) at the end.</param>
/// <param name="Accepted">Parts accepted (live: not undone) at the end.</param>
/// <param name="Unstable">Parts declared unstable during this run.</param>
/// <param name="Faults">Instrument faults recovered from during this run.</param>
/// <param name="FinishedByOperator">True when the operator pressed finish.</param>
/// <param name="StorageFaults">Failed writes to the precision log that were retried until they went through.</param>
public sealed record SortOutcome(
    long SessionId,
    int PartsRecorded,
    int Accepted,
    int Unstable,
    int Faults,
    bool FinishedByOperator,
    int StorageFaults = 0
)
{
    /// <summary>How the build ended when the session sorted toward one (--recipe, --sets); null otherwise.</summary>
    public BuildReport? Build { get; init; }
}
