namespace SortRig.Simulator.Meter;

/// <summary>
/// The resistance ranges (full scale, ohms) and the autorange rule: the SortRig envelope (docs/instruments.md),
/// invented for SortRig, not any real meter's range set or thresholds.
/// </summary>
internal static class ResistanceRanges
{
    /// <summary>Largest readable value as a multiple of full scale.</summary>
    public const double OverRange = 1.25;

    /// <summary>Autorange aims to read at or below this multiple of full scale (headroom under the 1.25x
    /// limit).</summary>
    public const double AutoTarget = 1.15;

    /// <summary>Decades from 100 Ohm to 10 MOhm and a 50 MOhm top range (16 nA test current, 0.8 V at full
    /// scale).</summary>
    public static readonly IReadOnlyList<double> All = [100, 1e3, 1e4, 1e5, 1e6, 1e7, 5e7];

    public const double Default = 1e4;

    public static double Min => All[0];

    public static double Max => All[^1];

    /// <summary>The smallest range whose full scale is at least <paramref name="ohms"/> (RANGe &lt;value&gt;), or null
    /// above 50 MOhm.</summary>
    public static double? Covering(double ohms) => All.Cast<double?>().FirstOrDefault(r => r >= ohms * (1 - 1e-12));

    /// <summary>
    /// Autorange: keep the range unless the value overloads it (&gt; 1.25 FS, or open) or fits the next
    /// range down with headroom (&lt;= 1.15 x FS/10); then go to the smallest range with the value &lt;= 1.15 FS.
    /// </summary>
    public static double AutoSelect(double current, double ohms, bool open)
    {
        if (open || double.IsNaN(ohms))
        {
            return Max;
        }

        var magnitude = Math.Abs(ohms);
        var keep = magnitude <= OverRange * current && magnitude > AutoTarget * current / 10;
        return keep ? current : All.FirstOrDefault(r => magnitude <= AutoTarget * r, Max);
    }
}
