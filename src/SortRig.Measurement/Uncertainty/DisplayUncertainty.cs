using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// Uncertainty of a value read by eye off a display (a meter with no computer link), from the range's spec:
/// a resolution term, half a digit as the half-width of a rectangular distribution (GUM 4.3.7, F.2.2.1), and the
/// accuracy term ±(% of reading + digits), also rectangular (GUM 4.3.7). See docs/measurement.md, "Typed readings".
/// </summary>
public static class DisplayUncertainty
{
    /// <summary>Standard uncertainty of the display's quantisation: (step / 2) / √3, in ohms.</summary>
    public static double Resolution(DisplayRange range)
    {
        ArgumentNullException.ThrowIfNull(range);
        return TypeB.Rectangular(range.Step / 2);
    }

    /// <summary>Standard uncertainty of the accuracy spec at <paramref name="value"/>: a / √3, a = % rdg × value +
    /// digits × step.</summary>
    public static double Accuracy(DisplayRange range, double value)
    {
        ArgumentNullException.ThrowIfNull(range);
        return TypeB.Rectangular(range.AccuracyHalfWidth(value));
    }

    /// <summary>
    /// The value with its absolute uncertainty √(u_res² + u_acc²) and its transfer uncertainty √(u_res² + (f·u_acc)²),
    /// f = <see cref="UncertaintyModel.ShortTermFractionOf24Hours"/> (the accuracy errors common to parts read on one
    /// range within a session cancel in a comparison, as for the SCPI meters); k = 2.
    /// </summary>
    /// <param name="range">The range the value was read on.</param>
    /// <param name="value">Ohms, finite.</param>
    /// <param name="model">Default <see cref="UncertaintyModel.Default"/>.</param>
    public static MeasuredValue For(DisplayRange range, double value, UncertaintyModel? model = null)
    {
        ArgumentNullException.ThrowIfNull(range);
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "A typed value must be finite.");
        }

        var f = (model ?? UncertaintyModel.Default).ShortTermFractionOf24Hours;
        var res = Resolution(range);
        var acc = Accuracy(range, value);
        return new MeasuredValue(
            value,
            Math.Sqrt((res * res) + (acc * acc)),
            Math.Sqrt((res * res) + (f * f * acc * acc))
        );
    }
}
