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

    /// <summary>Drift rate to two significant digits, signed: "+12 ppm/h", "-2.5 ppm/h", "+0.80 ppm/h"; "—" when
    /// unknown.</summary>
    public static string DriftRate(double? ppmPerHour)
    {
        if (ppmPerHour is not { } x || !double.IsFinite(x))
        {
            return "—";
        }

        var a = Math.Abs(x);
        var f =
            a >= 9.95 ? "+0;-0;0"
            : a >= 0.995 ? "+0.0;-0.0;0.0"
            : "+0.00;-0.00;0.00";
        return x.ToString(f, CultureInfo.InvariantCulture) + " ppm/h";
    }

    /// <summary>UTC date "2026-03-02".</summary>
    public static string Date(DateTimeOffset at) => at.UtcDateTime.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);

    /// <summary>Temperature "22.8" or "" when not measured.</summary>
    public static string Celsius(double? t) => t?.ToString("0.0", CultureInfo.InvariantCulture) ?? "";
}
