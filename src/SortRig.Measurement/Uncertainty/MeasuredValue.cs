namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// An accepted value with its GUM (JCGM 100:2008) standard uncertainties, in ohms.
/// </summary>
/// <param name="Value">Best estimate, ohms.</param>
/// <param name="StandardUncertainty">Combined standard uncertainty u_c, absolute (spec, resolution, Type A),
/// ohms.</param>
/// <param name="TransferUncertainty">Standard uncertainty that matters when comparing parts measured on the same
/// range within a short time (resolution, Type A, short-term stability), ohms. Always &lt;=
/// StandardUncertainty.</param>
/// <param name="CoverageFactor">k for the expanded uncertainty U = k u; default 2.</param>
public sealed record MeasuredValue(
    double Value,
    double StandardUncertainty,
    double TransferUncertainty,
    double CoverageFactor = 2.0
)
{
    /// <summary>Expanded absolute uncertainty U = k u_c, ohms.</summary>
    public double Expanded => CoverageFactor * StandardUncertainty;

    /// <summary>Expanded transfer uncertainty U = k u_transfer, ohms.</summary>
    public double ExpandedTransfer => CoverageFactor * TransferUncertainty;
}
