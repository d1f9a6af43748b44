namespace SortRig.Simulator.Meter;

/// <summary>
/// One integration-time setting and what it buys (our documented design, see docs/simulator.md):
/// displayed digits, quantisation step and RMS noise, both in ppm of the range full scale.
/// </summary>
internal sealed record NplcSetting(double Nplc, double Digits, double ResolutionPpm, double NoisePpm)
{
    /// <summary>The allowed settings, ascending. Noise falls roughly as 1/sqrt(t) from 1 to 10 NPLC, faster below 1 NPLC
    /// (short-aperture converter noise) and meets a 0.1 ppm floor (1/f noise) at 100 NPLC.</summary>
    public static readonly IReadOnlyList<NplcSetting> All =
    [
        new(0.02, 4.5, 100, 20),
        new(0.2, 5.5, 10, 3),
        new(1, 6.5, 1, 0.6),
        new(10, 6.5, 0.1, 0.2),
        new(100, 6.5, 0.1, 0.1),
    ];

    public static NplcSetting Default => All[2];

    public static NplcSetting? Find(double nplc) =>
        All.FirstOrDefault(s => Math.Abs(s.Nplc - nplc) <= s.Nplc * 1e-9);

    /// <summary>Quantisation step in ohms on a range.</summary>
    public double Step(double range) => ResolutionPpm * 1e-6 * range;

    /// <summary>RMS noise in ohms on a range.</summary>
    public double NoiseOhms(double range) => NoisePpm * 1e-6 * range;
}
