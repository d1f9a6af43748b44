using SortRig.Measurement.Drift;

namespace SortRig.Engine.DriftLogging;

/// <summary>Analysis of one stored channel (read back from the log).</summary>
/// <param name="Label">Stored label ("ch101", "pt100@105").</param>
/// <param name="Count">Samples stored.</param>
/// <param name="MeanOhms">Mean resistance, ohms (the ppm refer to it).</param>
/// <param name="Drift">Straight-line drift, ppm/h; null below 3 samples.</param>
/// <param name="Joint">Joint drift (ppm/h at constant temperature) and tempco (ppm/K); null when it cannot be
/// made.</param>
/// <param name="JointNote">Why there is no joint fit, or null.</param>
/// <param name="Adev">Overlapping Allan deviation at octave factors, tau0 = the run's interval.</param>
public sealed record DriftChannelResult(
    string Label,
    int Count,
    double MeanOhms,
    DriftFit? Drift,
    DriftTempcoFit? Joint,
    string? JointNote,
    IReadOnlyList<AllanPoint> Adev
);
