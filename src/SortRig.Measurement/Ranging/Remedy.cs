namespace SortRig.Measurement.Ranging;

/// <summary>Whether the meter can resolve the match band on the chosen range.</summary>
public enum RangeVerdict
{
    /// <summary>Expanded transfer uncertainty within the allowed share of the match band.</summary>
    Resolvable = 0,

    /// <summary>It is not; see the remedies.</summary>
    Refused = 1,
}

/// <summary>A single change to the request that lowers the transfer uncertainty or the demand.</summary>
public enum RemedyKind
{
    /// <summary>Use a longer integration time; Setting = the NPLC.</summary>
    RaiseNplc = 0,

    /// <summary>Measure 4-wire; Setting = 4 (wires).</summary>
    UseFourWire = 1,

    /// <summary>Use another range; Setting = its full scale, ohms. Parts above its limit read as overload.</summary>
    UseRange = 2,

    /// <summary>Accept a wider match band; Setting = the match tolerance fraction.</summary>
    LoosenMatch = 3,
}

/// <summary>A concrete remedy and what it would give.</summary>
/// <param name="Kind">What to change.</param>
/// <param name="Setting">The new setting (meaning depends on <see cref="Kind"/>).</param>
/// <param name="TransferUncertainty">Standard transfer uncertainty at nominal after the change, ohms.</param>
/// <param name="ExpandedTransfer">k × TransferUncertainty, ohms.</param>
/// <param name="Resolves">True when the change alone makes the request resolvable.</param>
public sealed record Remedy(
    RemedyKind Kind,
    double Setting,
    double TransferUncertainty,
    double ExpandedTransfer,
    bool Resolves
);
