using SortRig.Measurement.Drift;

namespace SortRig.Engine.DriftLogging;

/// <summary>What a drift run did and what the log says about each channel.</summary>
/// <param name="RunId">Drift run id in the precision log.</param>
/// <param name="Scans">Scans completed and logged.</param>
/// <param name="SamplesStored">Samples written to the log (new rows).</param>
/// <param name="Gaps">Gaps marked (faults, resets, lost connection).</param>
/// <param name="SkippedTicks">Scan times passed over because a scan or an outage ran past them.</param>
/// <param name="Overloads">Readings not logged because the meter reported overload (open channel or contact).</param>
/// <param name="Channels">Analysis per stored channel, part channels first, the Pt100 last.</param>
public sealed record DriftOutcome(
    long RunId,
    long Scans,
    long SamplesStored,
    int Gaps,
    long SkippedTicks,
    long Overloads,
    IReadOnlyList<DriftChannelResult> Channels
);
