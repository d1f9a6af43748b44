using System.Globalization;

namespace SortRig.Engine.Announcing;

/// <summary>Formats resistance and deviation the way a bench reads them.</summary>
public static class OhmsText
{
    /// <summary>"10.00321 kOhm" style with engineering prefix and the given significant digits.</summary>
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

        var (scale, prefix) = Math.Abs(ohms) switch
        {
            >= 1e6 => (1e6, "M"),
            >= 1e3 => (1e3, "k"),
            _ => (1.0, ""),
        };
        var scaled = ohms / scale;
        var intDigits = Math.Max(1, (int)Math.Floor(Math.Log10(Math.Max(Math.Abs(scaled), 1))) + 1);
        var decimals = Math.Max(0, significant - intDigits);
        return scaled.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture) + " " + prefix + "Ohm";
    }

    /// <summary>"+320 ppm" style, signed, whole ppm below 1000 and one decimal of percent above.</summary>
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
}
