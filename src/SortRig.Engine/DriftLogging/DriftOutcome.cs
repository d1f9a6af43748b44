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
    IReadOnlyList<DriftChannelResult> Channels);

/// <summary>Analysis of one stored channel (read back from the log).</summary>
/// <param name="Label">Stored label ("ch101", "pt100@120").</param>
/// <param name="Count">Samples stored.</param>
/// <param name="MeanOhms">Mean resistance, ohms (the ppm refer to it).</param>
/// <param name="Drift">Straight-line drift, ppm/h; null below 3 samples.</param>
/// <param name="Joint">Joint drift (ppm/h at constant temperature) and tempco (ppm/K); null when it cannot be made.</param>
/// <param name="JointNote">Why there is no joint fit, or null.</param>
/// <param name="Adev">Overlapping Allan deviation at octave factors, tau0 = the run's interval.</param>
public sealed record DriftChannelResult(
    string Label,
    int Count,
    double MeanOhms,
    DriftFit? Drift,
    DriftTempcoFit? Joint,
    string? JointNote,
    IReadOnlyList<AllanPoint> Adev);
