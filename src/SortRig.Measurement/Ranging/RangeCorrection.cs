using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>A measured correction from a high range to a lower range's scale.</summary>
/// <param name="Factor">Multiply a high-range value by this to put it on the low range's scale; dimensionless.</param>
/// <param name="RelativeStandardUncertainty">u(F)/F, dimensionless.</param>
/// <param name="LowRangeFullScale">Full scale of the low range, ohms.</param>
/// <param name="HighRangeFullScale">Full scale of the high range, ohms.</param>
public sealed record RangeCorrection(double Factor, double RelativeStandardUncertainty, double LowRangeFullScale, double HighRangeFullScale)
{
    /// <summary>
    /// A high-range value expressed on the low range's scale: v·F, with the correction's relative uncertainty
    /// added in quadrature to both its absolute and transfer uncertainties (first order, uncorrelated).
    /// </summary>
    public MeasuredValue Apply(MeasuredValue valueOnHigh)
    {
        ArgumentNullException.ThrowIfNull(valueOnHigh);
        var value = valueOnHigh.Value * Factor;
        var fromFactor = Math.Abs(value) * RelativeStandardUncertainty;
        return new MeasuredValue(
            value,
            Hypot(valueOnHigh.StandardUncertainty * Factor, fromFactor),
            Hypot(valueOnHigh.TransferUncertainty * Factor, fromFactor),
            valueOnHigh.CoverageFactor);
    }

    private static double Hypot(double a, double b) => Math.Sqrt((a * a) + (b * b));
}
