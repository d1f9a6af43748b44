namespace SortRig.Reporting.Reports;

/// <summary>Everything a report is made from; the host maps stored rows to these records.</summary>
/// <param name="Title">Report title (first heading of summary.md).</param>
/// <param name="Parts">Measured parts; may be empty.</param>
/// <param name="Reels">Stock tolerance and cup edges per nominal; nominals without an entry get no limit lines.</param>
/// <param name="DriftSamples">Drift log samples of any number of channels; may be empty.</param>
public sealed record ReportInput(
    string Title,
    IReadOnlyList<ReportPart> Parts,
    IReadOnlyList<ReportReel> Reels,
    IReadOnlyList<ReportDriftSample> DriftSamples
);

/// <summary>One measured part.</summary>
/// <param name="Number">Part number within the session (shown in CSV).</param>
/// <param name="NominalOhms">Nominal resistance, ohms; finite and &gt; 0.</param>
/// <param name="ValueOhms">Accepted measured value, ohms; finite and &gt; 0.</param>
/// <param name="StandardUncertaintyOhms">Standard uncertainty of the value (k = 1), ohms; finite and &gt;= 0.</param>
/// <param name="Cup">Cup the part went to, or null when not sorted.</param>
/// <param name="AcceptedAt">When the value was accepted, for the pace line of summary.md; null when not known.</param>
/// <param name="AcceptedBy">The settle rule that accepted it ("Averaging", "Predictive"); null when not
/// recorded.</param>
public sealed record ReportPart(
    int Number,
    double NominalOhms,
    double ValueOhms,
    double StandardUncertaintyOhms,
    string? Cup,
    DateTimeOffset? AcceptedAt = null,
    string? AcceptedBy = null
);

/// <summary>Stock data of a reel (all parts of one nominal).</summary>
/// <param name="NominalOhms">Nominal resistance, ohms; finite and &gt; 0.</param>
/// <param name="TolerancePercent">Stock tolerance, percent; finite and &gt; 0.</param>
/// <param name="CupEdgesPpm">Cup boundaries in ppm of nominal, drawn on the histogram; may be empty.</param>
public sealed record ReportReel(double NominalOhms, double TolerancePercent, IReadOnlyList<double> CupEdgesPpm);

/// <summary>One drift-log sample.</summary>
/// <param name="Time">When the reading was taken.</param>
/// <param name="Channel">Channel (part or scanner slot) name; not empty.</param>
/// <param name="Ohms">Reading, ohms; finite and &gt; 0.</param>
/// <param name="TemperatureC">Temperature at that time, degC, or null.</param>
public sealed record ReportDriftSample(DateTimeOffset Time, string Channel, double Ohms, double? TemperatureC);
