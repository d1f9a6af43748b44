namespace SortRig.Measurement.Specs;

/// <summary>
/// The metrology of a meter family: what the measurement rules need to know about it.
/// Loaded from a profile in instruments/ by the instrument layer.
/// </summary>
/// <param name="Family">Our generic family name (e.g. "bench-6half-lan").</param>
/// <param name="Ranges">Resistance ranges, ascending by full scale.</param>
/// <param name="Nplcs">Integration-time settings, ascending by NPLC.</param>
/// <param name="FourWire">True when the meter can measure 4-wire resistance.</param>
/// <param name="RangeChangeSettle">Time to wait after a range change before trusting readings.</param>
public sealed record MeterSpec(
    string Family,
    IReadOnlyList<RangeSpec> Ranges,
    IReadOnlyList<NplcSpec> Nplcs,
    bool FourWire,
    TimeSpan RangeChangeSettle
);
