using CsvHelper;
using SortRig.Reporting.Plots;
using SortRig.Reporting.Reports;
using SortRig.Storage;

namespace SortRig.Host.ReportVerb;

/// <summary>One histogram bin as written beside each histogram PNG (the counts drawn in it).</summary>
/// <param name="NominalOhms">Nominal of the reel, ohms.</param>
/// <param name="LowPpm">Bin's lower edge (included), ppm of nominal.</param>
/// <param name="HighPpm">Bin's upper edge (excluded), ppm of nominal.</param>
/// <param name="Count">Parts in the bin.</param>
[CsvRecord]
internal sealed partial record HistogramBinCsvRow(double NominalOhms, double LowPpm, double HighPpm, int Count);
