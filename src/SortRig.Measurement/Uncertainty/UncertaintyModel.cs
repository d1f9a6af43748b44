namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// The assumptions of the resistance uncertainty model that are not in the meter's data sheet.
/// Shared by the range rule (prediction at a nominal) and the settle rule (accepted values).
/// </summary>
public sealed record UncertaintyModel
{
    private readonly double _shortTermFraction = 0.1;
    private readonly double _leadVariation = 0.1;

    /// <summary>The default model.</summary>
    public static UncertaintyModel Default { get; } = new();

    /// <summary>
    /// Short-term (transfer) stability as a fraction of the 24 h spec half-width, treated as the half-width of
    /// a rectangular distribution: u_st = f · a_24h / √3. Dimensionless; default 0.1; valid [0, 1].
    /// Our engineering assumption for comparisons made within minutes to hours on one range.
    /// </summary>
    public double ShortTermFractionOf24Hours
    {
        get => _shortTermFraction;
        init =>
            _shortTermFraction =
                double.IsFinite(value) && value is >= 0 and <= 1
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(ShortTermFractionOf24Hours),
                        value,
                        "ShortTermFractionOf24Hours must be in [0, 1]."
                    );
    }

    /// <summary>
    /// 2-wire only: variation of lead plus contact resistance between insertions, ohms, treated as the
    /// half-width of a rectangular distribution: u_lead = δ / √3. Default 0.1 ohm (typical figure, from memory);
    /// valid [0, 10].
    /// </summary>
    public double LeadVariationOhms
    {
        get => _leadVariation;
        init =>
            _leadVariation =
                double.IsFinite(value) && value is >= 0 and <= 10
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(LeadVariationOhms),
                        value,
                        "LeadVariationOhms must be in [0, 10] ohms."
                    );
    }
}
