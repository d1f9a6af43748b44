using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>The range rule's answer for one nominal. All absolute figures are in ohms at the nominal.</summary>
/// <param name="Request">The request answered.</param>
/// <param name="Range">Lowest range whose limit holds <see cref="RangeRequest.RequiredLimit"/>.</param>
/// <param name="Nplc">The NPLC setting of the request.</param>
/// <param name="ResolutionOhms">Least significant step on the range, ohms.</param>
/// <param name="ResolutionPpm">That step in ppm of the nominal.</param>
/// <param name="SpecHalfWidth24Hours">24 h spec half-width at nominal, ohms.</param>
/// <param name="SpecHalfWidth1Year">1 year spec half-width at nominal, ohms.</param>
/// <param name="TransferBudget">Predicted transfer budget at nominal (resolution, noise of the mean, short-term,
/// lead).</param>
/// <param name="TransferUncertainty">Its combined standard uncertainty, ohms.</param>
/// <param name="ExpandedTransfer">k × TransferUncertainty, ohms.</param>
/// <param name="AllowedExpanded">UncertaintyRatio × MatchTolerance × Nominal, ohms.</param>
/// <param name="Verdict">Resolvable when ExpandedTransfer &lt;= AllowedExpanded.</param>
/// <param name="Remedies">Empty when resolvable; otherwise the remedies found, most direct first.</param>
public sealed record RangeDecision(
    RangeRequest Request,
    RangeSpec Range,
    NplcSpec Nplc,
    double ResolutionOhms,
    double ResolutionPpm,
    double SpecHalfWidth24Hours,
    double SpecHalfWidth1Year,
    Budget TransferBudget,
    double TransferUncertainty,
    double ExpandedTransfer,
    double AllowedExpanded,
    RangeVerdict Verdict,
    IReadOnlyList<Remedy> Remedies
)
{
    /// <summary>Expanded transfer uncertainty in ppm of nominal.</summary>
    public double ExpandedTransferPpm => ExpandedTransfer / Request.Nominal * 1e6;
}
