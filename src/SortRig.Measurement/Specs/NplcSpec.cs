namespace SortRig.Measurement.Specs;

/// <summary>One integration-time setting of a meter.</summary>
/// <param name="Nplc">Integration time in power-line cycles (e.g. 0.02, 1, 10, 100).</param>
/// <param name="Digits">Displayed digits at this setting (e.g. 6.5 for 6½ digits).</param>
/// <param name="ResolutionPpmOfRange">Least significant step, in ppm of the range full scale.</param>
/// <param name="ReadingsPerSecond">Reading rate with autozero on, at 50 Hz line.</param>
/// <param name="NoisePpmOfRange">RMS reading noise in ppm of range (typical); 0 when unknown.</param>
public sealed record NplcSpec(
    double Nplc,
    double Digits,
    double ResolutionPpmOfRange,
    double ReadingsPerSecond,
    double NoisePpmOfRange
)
{
    /// <summary>Resolution in ohms on a range of the given full scale.</summary>
    public double Resolution(double rangeFullScale) => ResolutionPpmOfRange * 1e-6 * rangeFullScale;
}
