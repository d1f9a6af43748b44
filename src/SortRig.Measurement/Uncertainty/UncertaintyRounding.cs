using System.Globalization;

namespace SortRig.Measurement.Uncertainty;

/// <summary>How a measured value is quoted with its expanded uncertainty (invariant culture). Pure.</summary>
public static class UncertaintyRounding
{
    /// <summary>
    /// Value and expanded uncertainty rounded together: U to two significant digits and the value to the same
    /// decimal place (JCGM 100:2008 sec. 7.2.6: "at most two significant digits"). U = 0 gives the value in G9.
    /// </summary>
    public static (string Value, string Uncertainty) Round(double value, double expanded)
    {
        if (!(expanded > 0) || !double.IsFinite(expanded))
        {
            return (value.ToString("G9", CultureInfo.InvariantCulture), "0");
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
