using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>A measured correction that puts values read on one range onto another range's scale.</summary>
/// <param name="Factor">Multiply a value read on the "from" range by this to put it on the "to" range's scale;
/// dimensionless.</param>
/// <param name="RelativeStandardUncertainty">u(F)/F, dimensionless.</param>
/// <param name="ToRangeFullScale">Full scale of the range whose scale the values are put on, ohms.</param>
/// <param name="FromRangeFullScale">Full scale of the range the corrected values are read on, ohms.</param>
public sealed record RangeCorrection(
    double Factor,
    double RelativeStandardUncertainty,
    double ToRangeFullScale,
    double FromRangeFullScale
)
{
    /// <summary>
    /// A value read on the "from" range expressed on the "to" range's scale: v·F, with the correction's relative
    /// uncertainty added in quadrature to both its absolute and transfer uncertainties (first order, uncorrelated).
    /// </summary>
    public MeasuredValue Apply(MeasuredValue valueOnFrom)
    {
        ArgumentNullException.ThrowIfNull(valueOnFrom);
        var value = valueOnFrom.Value * Factor;
        var fromFactor = Math.Abs(value) * RelativeStandardUncertainty;
        return new MeasuredValue(
            value,
            Hypot(valueOnFrom.StandardUncertainty * Factor, fromFactor),
            Hypot(valueOnFrom.TransferUncertainty * Factor, fromFactor),
            valueOnFrom.CoverageFactor
        );
    }

    /// <summary>
    /// The same correction the other way round: 1/F, from the "to" range onto the "from" range. The relative
    /// standard uncertainty is unchanged (sensitivity of 1/F to F is -1/F², so u(1/F)/(1/F) = u(F)/F; JCGM 100:2008
    /// sec. 5.1.6 with exponent -1).
    /// </summary>
    public RangeCorrection Inverted() =>
        new(1 / Factor, RelativeStandardUncertainty, FromRangeFullScale, ToRangeFullScale);

    private static double Hypot(double a, double b) => Math.Sqrt((a * a) + (b * b));
}
