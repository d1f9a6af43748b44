using SortRig.Measurement.Uncertainty;

namespace SortRig.Planning.Assembly;

/// <summary>A measured part offered to the assembler.</summary>
/// <param name="Id">Part number, unique in one call.</param>
/// <param name="Nominal">Marked nominal resistance, ohms.</param>
/// <param name="Value">Accepted value with uncertainties; the expanded transfer uncertainty is what counts against
/// specs.</param>
/// <param name="Location">Where the part is (slot label such as "T1-A07", or cup label), or null.</param>
public sealed record PartCandidate(long Id, double Nominal, MeasuredValue Value, string? Location);
