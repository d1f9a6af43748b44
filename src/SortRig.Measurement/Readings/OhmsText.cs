using System.Globalization;

namespace SortRig.Measurement.Readings;

/// <summary>
/// The one formatter of resistance and deviation text: engineering prefix (k = 1e3, M = 1e6), invariant culture.
/// Forms: bench (<see cref="Format"/>), nominal (<see cref="Nominal"/>), compact for plots and reports
/// (<see cref="Compact"/>), file name (<see cref="FileToken"/>), deviation (<see cref="Ppm"/>).
/// </summary>
public static class OhmsText
{
    /// <summary>"10.00321 kOhm": engineering prefix and <paramref name="significant"/> digits (default 7); "OPEN" for
    /// an overload, "-" for NaN.</summary>
    public static string Format(double ohms, int significant = 7)
    {
        if (double.IsNaN(ohms))
        {
            return "-";
        }

        if (double.IsInfinity(ohms))
        {
            return "OPEN";
        }

        var (scale, prefix) = Prefix(ohms);
        var scaled = ohms / scale;
        var intDigits = Math.Max(1, (int)Math.Floor(Math.Log10(Math.Max(Math.Abs(scaled), 1))) + 1);
        var decimals = Math.Max(0, significant - intDigits);
        return scaled.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture)
            + " "
            + prefix
            + "Ohm";
    }

    /// <summary>A nominal, short, plain ASCII for labels: "10 kOhm", "4.990 kOhm", "100 Ohm" (four digits; all-zero
    /// decimals dropped).</summary>
    public static string Nominal(double ohms) =>
        Format(ohms, 4)
            .Replace(".000 ", " ", StringComparison.Ordinal)
            .Replace(".00 ", " ", StringComparison.Ordinal)
            .Replace(".0 ", " ", StringComparison.Ordinal);

    /// <summary>Compact, for plot titles and report tables: "4.99k Ω", "10k Ω", "1M Ω", "470 Ω" (four significant
    /// digits).</summary>
    public static string Compact(double ohms)
    {
        var (scale, prefix) = Prefix(ohms);
        return (ohms / scale).ToString("G4", CultureInfo.InvariantCulture) + prefix + " Ω";
    }

    /// <summary>File-name-safe form: 4.99k -> 4k99, 10k -> 10k, 470 -> 470R.</summary>
    public static string FileToken(double ohms)
    {
        var (scale, prefix) = Prefix(ohms);
        var suffix = prefix.Length == 0 ? "R" : prefix;
        var text = (ohms / scale).ToString("G4", CultureInfo.InvariantCulture);
        return text.Contains('.', StringComparison.Ordinal)
            ? text.Replace(".", suffix, StringComparison.Ordinal)
            : text + suffix;
    }

    /// <summary>"+320 ppm" style, signed, whole ppm below 1 % and two decimals of percent from 1 % up; "-" for
    /// NaN.</summary>
    public static string Ppm(double ppm)
    {
        if (double.IsNaN(ppm))
        {
            return "-";
        }

        return Math.Abs(ppm) >= 10_000
            ? (ppm / 1e4).ToString("+0.00;-0.00", CultureInfo.InvariantCulture) + " %"
            : ppm.ToString("+0;-0;0", CultureInfo.InvariantCulture) + " ppm";
    }

    private static (double Scale, string Prefix) Prefix(double ohms) =>
        Math.Abs(ohms) switch
        {
            >= 1e6 => (1e6, "M"),
            >= 1e3 => (1e3, "k"),
            _ => (1.0, ""),
        };
}
