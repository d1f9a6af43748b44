using System.Globalization;
using SortRig.Host.LibraryVerb;

namespace SortRig.Host.VerbSupport;

/// <summary>Number formats of the library verbs (invariant culture, plain ASCII for label printers).</summary>
internal static class Format
{
    /// <summary>Measured value in ohms with up to nine significant digits.</summary>
    public static string Value(double ohms) => ohms.ToString("G9", CultureInfo.InvariantCulture);

    /// <summary>Signed deviation, one decimal: "-12.5".</summary>
    public static string Ppm(double ppm) => ppm.ToString("+0.0;-0.0;0.0", CultureInfo.InvariantCulture);

    /// <summary>Drift rate to two significant digits, signed: "+12 ppm/h", "-2.5 ppm/h", "+0.80 ppm/h"; "—" when unknown.</summary>
    public static string DriftRate(double? ppmPerHour)
    {
        if (ppmPerHour is not { } x || !double.IsFinite(x))
        {
            return "—";
        }

        var a = Math.Abs(x);
        var f = a >= 9.95 ? "+0;-0;0" : a >= 0.995 ? "+0.0;-0.0;0.0" : "+0.00;-0.00;0.00";
        return x.ToString(f, CultureInfo.InvariantCulture) + " ppm/h";
    }

    /// <summary>UTC date "2026-03-02".</summary>
    public static string Date(DateTimeOffset at) => at.UtcDateTime.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>Temperature "22.8" or "" when not measured.</summary>
    public static string Celsius(double? t) => t?.ToString("0.0", CultureInfo.InvariantCulture) ?? "";

    /// <summary>
    /// Value and expanded uncertainty rounded together: U to two significant digits and the value to the same
    /// decimal place (JCGM 100:2008 sec. 7.2.6: "at most two significant digits"). U = 0 gives the value in G9.
    /// </summary>
    public static (string Value, string Uncertainty) WithUncertainty(double value, double expanded)
    {
        if (!(expanded > 0) || !double.IsFinite(expanded))
        {
            return (Value(value), "0");
        }

        var decimals = Math.Clamp(1 - (int)Math.Floor(Math.Log10(expanded)), 0, 12);
        var rounded = Math.Round(expanded, decimals, MidpointRounding.AwayFromZero);
        // Rounding may carry U to three digits (0.0995 -> 0.100); one decimal fewer keeps two.
        if (decimals > 0 && rounded >= 100 * Math.Pow(10, -decimals))
        {
            decimals--;
        }

        var f = "F" + decimals.ToString(CultureInfo.InvariantCulture);
        return (value.ToString(f, CultureInfo.InvariantCulture), expanded.ToString(f, CultureInfo.InvariantCulture));
    }
}
