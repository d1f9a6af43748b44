namespace SortRig.Simulator.Meter;

/// <summary>
/// One integration-time setting and what it buys (our documented design, see docs/simulator.md):
/// displayed digits, quantisation step and RMS noise, both in ppm of the range full scale.
/// </summary>
internal sealed record NplcSetting(double Nplc, double Digits, double ResolutionPpm, double NoisePpm)
{
    /// <summary>The allowed settings, ascending: the SortRig envelope (docs/instruments.md), invented for SortRig.
    /// Noise falls roughly as 1/sqrt(t) from 1 to 10 NPLC (0.7 ppm at 1 NPLC), faster below 1 NPLC (short-aperture
    /// converter noise) and flattens towards a 0.15 ppm floor (1/f noise) at 40 NPLC.</summary>
    public static readonly IReadOnlyList<NplcSetting> All =
    [
        new(0.04, 4.5, 40, 12),
        new(0.4, 5.5, 4, 2),
        new(1, 6.5, 1, 0.7),
        new(4, 6.5, 0.5, 0.35),
        new(10, 6.5, 0.2, 0.25),
        new(40, 6.5, 0.1, 0.15),
    ];

    public static NplcSetting Default => All[2];

    public static NplcSetting? Find(double nplc) => All.FirstOrDefault(s => Math.Abs(s.Nplc - nplc) <= s.Nplc * 1e-9);

    /// <summary>Quantisation step in ohms on a range.</summary>
    public double Step(double range) => ResolutionPpm * 1e-6 * range;

    /// <summary>RMS noise in ohms on a range.</summary>
    public double NoiseOhms(double range) => NoisePpm * 1e-6 * range;
}
