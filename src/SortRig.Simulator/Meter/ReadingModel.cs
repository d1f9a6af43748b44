namespace SortRig.Simulator.Meter;

/// <summary>
/// Turns what the input presents into what the meter reports (pure): add lead resistance (2-wire),
/// apply the range's gain factor, add Gaussian noise, quantise to the step of the range and NPLC, and report the SCPI
/// overflow value for an open input or a value above 1.25 x full scale.
/// </summary>
internal static class ReadingModel
{
    /// <summary>SCPI-99 overflow value (SCPI-99 vol. 1 sec. 7.2.1.5: 9.9E37).</summary>
    public const double Overflow = 9.9e37;

    public static double Report(
        bool open,
        double ohms,
        double range,
        NplcSetting nplc,
        double standardNormal,
        double leadOhms,
        double gainFactor = 1
    )
    {
        if (open || !double.IsFinite(ohms))
        {
            return Overflow;
        }

        var noisy = ((ohms + leadOhms) * gainFactor) + (standardNormal * nplc.NoiseOhms(range));
        var step = nplc.Step(range);
        var quantised = Math.Round(noisy / step, MidpointRounding.AwayFromZero) * step;
        return Math.Abs(quantised) > ResistanceRanges.OverRange * range ? Overflow : quantised;
    }

    public static bool IsOverflow(double value) => value >= Overflow * 0.99;
}
