using SortRig.Measurement.Drift;

namespace SortRig.Reporting.Reports;

/// <summary>Statistics of the parts of one nominal, in ppm of nominal.</summary>
/// <param name="NominalOhms">Nominal, ohms.</param>
/// <param name="Count">Number of parts.</param>
/// <param name="MeanPpm">Mean deviation from nominal, ppm.</param>
/// <param name="StdDevPpm">Sample standard deviation (n - 1), ppm; NaN for a single part.</param>
/// <param name="MinPpm">Smallest deviation, ppm.</param>
/// <param name="MaxPpm">Largest deviation, ppm.</param>
/// <param name="TolerancePercent">Stock tolerance from the reel data, percent, or null.</param>
/// <param name="HistogramFile">File name of the histogram PNG in the report folder.</param>
public sealed record NominalSummary(
    double NominalOhms,
    int Count,
    double MeanPpm,
    double StdDevPpm,
    double MinPpm,
    double MaxPpm,
    double? TolerancePercent,
    string HistogramFile
);

/// <summary>Results for one drift channel.</summary>
/// <param name="Channel">Channel name.</param>
/// <param name="Count">Number of samples.</param>
/// <param name="ReferenceOhms">Mean of the channel's readings, ohms; ppm refer to it.</param>
/// <param name="SpanHours">First to last sample, hours.</param>
/// <param name="Tau0Seconds">Median sampling interval, seconds (ADEV tau0); NaN below 2 samples.</param>
/// <param name="EvenlySpaced">True when every interval is within 25 % of the median (ADEV assumes even
/// spacing).</param>
/// <param name="Drift">Straight-line drift fit, or null below 3 samples.</param>
/// <param name="Joint">Joint drift + tempco fit, or null when it cannot be made (see <paramref
/// name="JointNote"/>).</param>
/// <param name="JointNote">Why there is no joint fit, or null.</param>
/// <param name="Adev">Overlapping ADEV at octave averaging factors; empty below 3 samples.</param>
/// <param name="DriftPlotFile">File name of the drift PNG.</param>
/// <param name="AdevPlotFile">File name of the ADEV PNG, or null when there are no ADEV points.</param>
public sealed record ChannelSummary(
    string Channel,
    int Count,
    double ReferenceOhms,
    double SpanHours,
    double Tau0Seconds,
    bool EvenlySpaced,
    DriftFit? Drift,
    DriftTempcoFit? Joint,
    string? JointNote,
    IReadOnlyList<AllanPoint> Adev,
    string DriftPlotFile,
    string? AdevPlotFile
);

/// <summary>What <see cref="ReportWriter.WriteAsync"/> wrote and computed.</summary>
/// <param name="Folder">Report folder (full path).</param>
/// <param name="SummaryPath">Full path of summary.md.</param>
/// <param name="Files">File names written in the folder, in writing order.</param>
/// <param name="Nominals">Per-nominal part statistics.</param>
/// <param name="Channels">Per-channel drift results.</param>
/// <param name="CupCounts">Parts per cup (parts without a cup are not counted), ordered by cup name.</param>
public sealed record ReportManifest(
    string Folder,
    string SummaryPath,
    IReadOnlyList<string> Files,
    IReadOnlyList<NominalSummary> Nominals,
    IReadOnlyList<ChannelSummary> Channels,
    IReadOnlyList<KeyValuePair<string, int>> CupCounts
);
