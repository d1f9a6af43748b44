using CsvHelper;

namespace SortRig.Reporting.Reports;

/// <summary>A row of parts.csv.</summary>
/// <param name="Number">Part number.</param>
/// <param name="NominalOhms">Nominal, ohms.</param>
/// <param name="ValueOhms">Accepted value, ohms.</param>
/// <param name="DeviationPpm">(value / nominal - 1) * 1e6.</param>
/// <param name="StandardUncertaintyOhms">Standard uncertainty, ohms (k = 1).</param>
/// <param name="Cup">Cup, empty when not sorted.</param>
[CsvRecord]
public sealed partial record PartCsvRow(
    int Number,
    double NominalOhms,
    double ValueOhms,
    double DeviationPpm,
    double StandardUncertaintyOhms,
    string Cup
);

/// <summary>A row of drift_samples.csv.</summary>
/// <param name="Time">ISO 8601 round-trip time with offset.</param>
/// <param name="Channel">Channel name.</param>
/// <param name="Ohms">Reading, ohms.</param>
/// <param name="TemperatureC">Temperature, degC; empty when not logged.</param>
[CsvRecord]
public sealed partial record DriftCsvRow(
    [CsvFormat("O")] DateTimeOffset Time,
    string Channel,
    double Ohms,
    double? TemperatureC
);

/// <summary>A row of adev.csv.</summary>
/// <param name="Channel">Channel name.</param>
/// <param name="AveragingFactor">m.</param>
/// <param name="TauSeconds">tau = m tau0, seconds.</param>
/// <param name="AdevPpm">Overlapping Allan deviation, ppm.</param>
/// <param name="LowerPpm">Lower 68 % bound, ppm.</param>
/// <param name="UpperPpm">Upper 68 % bound, ppm.</param>
/// <param name="Terms">Number of terms averaged.</param>
/// <param name="Edf">Equivalent degrees of freedom (white FM assumption).</param>
[CsvRecord]
public sealed partial record AdevCsvRow(
    string Channel,
    int AveragingFactor,
    double TauSeconds,
    double AdevPpm,
    double LowerPpm,
    double UpperPpm,
    int Terms,
    double Edf
);
