namespace SortRig.Engine.Events;

/// <summary>
/// One event on the bench's stream. Flat on purpose: it is written as JSON to server-sent events.
/// </summary>
/// <param name="Sequence">Monotonic per hub, from 1.</param>
/// <param name="Kind">What happened.</param>
/// <param name="Time">When, from the host's TimeProvider.</param>
/// <param name="PartNumber">Part number within the session, when the event is about a part.</param>
/// <param name="Cup">Cup or slot label, for announcements.</param>
/// <param name="Value">Ohms (reading or accepted value).</param>
/// <param name="DeviationPpm">Deviation from nominal in ppm.</param>
/// <param name="State">Settle state name or notice category.</param>
/// <param name="Text">Plain text for people.</param>
/// <param name="Counts">Cup label to count, for Counts events.</param>
public sealed record BenchEvent(
    long Sequence,
    BenchEventKind Kind,
    DateTimeOffset Time,
    long? PartNumber = null,
    string? Cup = null,
    double? Value = null,
    double? DeviationPpm = null,
    string? State = null,
    string? Text = null,
    IReadOnlyDictionary<string, int>? Counts = null
);
