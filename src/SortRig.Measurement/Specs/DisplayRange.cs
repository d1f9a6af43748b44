using System.Globalization;

namespace SortRig.Measurement.Specs;

/// <summary>
/// One resistance range of a meter read by eye: the display shows at most counts − 1 steps of
/// <see cref="Step"/> ohms, and the accuracy is ±(% of reading + digits), a digit being one step.
/// </summary>
/// <param name="FullScale">The range's name in ohms (the 50 kΩ range shows up to 49.999 kΩ on a 50 000-count display);
/// &gt; 0.</param>
/// <param name="Counts">Display counts; the largest display is counts − 1 steps. 100 to 10 000 000.</param>
/// <param name="ReadingPct">Accuracy term in % of reading, 0 to 10.</param>
/// <param name="Digits">Accuracy term in digits (steps), 0 to 1000.</param>
public sealed record DisplayRange(double FullScale, int Counts, double ReadingPct, double Digits)
{
    /// <summary>One digit (the least significant step of the display) in ohms: full scale / counts.</summary>
    public double Step => FullScale / Counts;

    /// <summary>The largest value the display shows before it reads overload, in ohms.</summary>
    public double DisplayMax => (Counts - 1) * Step;

    /// <summary>Multiplier of the unit the display shows on this range: 1 (Ω), 1e3 (kΩ) or 1e6 (MΩ).</summary>
    public double UnitScale =>
        FullScale >= 1e6 * 0.999 ? 1e6
        : FullScale >= 1e3 * 0.999 ? 1e3
        : 1;

    /// <summary>The unit's name: "Ohm", "kOhm" or "MOhm".</summary>
    public string UnitName =>
        UnitScale switch
        {
            1e6 => "MOhm",
            1e3 => "kOhm",
            _ => "Ohm",
        };

    /// <summary>Decimal places the display shows in <see cref="UnitName"/>.</summary>
    public int Decimals => Math.Max(0, (int)Math.Round(-Math.Log10(Step / UnitScale)));

    /// <summary>Accuracy half-width in ohms at <paramref name="value"/>: % of reading × value + digits ×
    /// step.</summary>
    public double AccuracyHalfWidth(double value) => (ReadingPct / 100 * Math.Abs(value)) + (Digits * Step);

    /// <summary>A value as this range's display shows it, e.g. "10.003 kOhm".</summary>
    public string Show(double ohms) =>
        (ohms / UnitScale).ToString("F" + Decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture)
        + " "
        + UnitName;

    /// <summary>The range's name, e.g. "50 kOhm".</summary>
    public string Name => (FullScale / UnitScale).ToString("G6", CultureInfo.InvariantCulture) + " " + UnitName;
}
