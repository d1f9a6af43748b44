using System.Globalization;

namespace SortRig.Reporting.Plots;

/// <summary>Short engineering text for a resistance: 4.99k, 10k, 1M, 470 (ohms).</summary>
internal static class OhmsText
{
    public static string Format(double ohms)
    {
        (double scaled, string suffix) = ohms switch
        {
            >= 1e6 => (ohms / 1e6, "M"),
            >= 1e3 => (ohms / 1e3, "k"),
            _ => (ohms, string.Empty),
        };
        return scaled.ToString("G4", CultureInfo.InvariantCulture) + suffix + " Ω";
    }

    /// <summary>File-name-safe form: 4.99k -> 4k99, 10k -> 10k, 470 -> 470R.</summary>
    public static string FileToken(double ohms)
    {
        (double scaled, string suffix) = ohms switch
        {
            >= 1e6 => (ohms / 1e6, "M"),
            >= 1e3 => (ohms / 1e3, "k"),
            _ => (ohms, "R"),
        };
        string text = scaled.ToString("G4", CultureInfo.InvariantCulture);
        return text.Contains('.', StringComparison.Ordinal) ? text.Replace(".", suffix, StringComparison.Ordinal) : text + suffix;
    }
}
