namespace SortRig.Measurement.Settling;

/// <summary>
/// The fit behind a predictive acceptance: the predicted final value and its standard uncertainty, split into the
/// fit's own part and the model-misfit part (GUM, JCGM 100:2008, 5.1.2: combined in quadrature).
/// </summary>
/// <param name="Model">The model with the larger Akaike weight.</param>
/// <param name="FinalValue">Predicted settled value, ohms (model-averaged over the fitted models).</param>
/// <param name="FitUncertainty">From the fit covariance s²(JᵀJ)⁻¹, inflated for correlated residuals, ohms.</param>
/// <param name="MisfitUncertainty">Model misfit: the spread between models and the misfit allowance on the part
/// of the recovery still to come, ohms.</param>
/// <param name="TimeConstantsSeconds">The chosen model's time constants, shortest first, s.</param>
/// <param name="Readings">Readings fitted.</param>
/// <param name="SpanSeconds">Time covered by the fitted readings, s.</param>
/// <param name="ResidualRms">Root-mean-square residual of the chosen model, ohms.</param>
/// <param name="RunsZ">Runs test z of the chosen model's residuals (below about −2.3 fails at 1 %).</param>
/// <param name="Weight">Akaike weight of the chosen model, 0..1.</param>
public sealed record RecoveryFit(
    RecoveryModel Model,
    double FinalValue,
    double FitUncertainty,
    double MisfitUncertainty,
    IReadOnlyList<double> TimeConstantsSeconds,
    int Readings,
    double SpanSeconds,
    double ResidualRms,
    double RunsZ,
    double Weight
)
{
    /// <summary>The slowest (body) time constant of the model the data favour, fitted without the reel's prior, s;
    /// NaN when not fitted. What the reel-learned prior (<see cref="ReelPrior"/>) learns from.</summary>
    public double BodyTimeConstant { get; init; } = double.NaN;

    /// <summary>Standard error of <see cref="BodyTimeConstant"/> (linearised, s² inflated as the fit's), s.</summary>
    public double BodyStandardError { get; init; } = double.PositiveInfinity;

    /// <summary>
    /// The record resolved the body: residuals passed the runs and step tests, the record covers at least twice the
    /// assumed longest time constant, the body is fitted below that bound with a standard error at most 5 % of it.
    /// What <see cref="ReelPrior"/> learns from.
    /// </summary>
    public bool BodyResolved { get; init; }

    /// <summary>The floor of the body range (or, under the reel's learned distribution, of the learned range beside
    /// it) the interval was taken under, s; null: the wide prior (none learned yet, a record too short for it, the
    /// part's record refused the range, or a one-path fit whose own interval was the narrower).</summary>
    public double? BodyFloor { get; init; }

    /// <summary>Combined standard uncertainty of <see cref="FinalValue"/>, ohms.</summary>
    public double StandardUncertainty =>
        Math.Sqrt((FitUncertainty * FitUncertainty) + (MisfitUncertainty * MisfitUncertainty));
}
