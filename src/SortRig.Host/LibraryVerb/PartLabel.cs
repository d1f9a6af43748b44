using System.Globalization;
using SortRig.Engine.Picking;
using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Host.LibraryVerb;

/// <summary>
/// A plain label for one part: five lines of exactly <see cref="Width"/> ASCII characters, for a text label printer.
/// <code>
/// #123                  10 kOhm
/// R 9999.873 Ohm
/// U 0.024 Ohm (k=2)
/// dev -12.7 ppm     at 22.8 degC
/// 2026-03-02  T1-A07
/// </code>
/// U is the expanded (absolute) uncertainty, rounded to two significant digits with the value to match.
/// </summary>
internal static class PartLabel
{
    /// <summary>Characters per line (32 fits a 1 in. label at a small font: common practice, no source).</summary>
    public const int Width = 32;

    /// <summary>Lines per label.</summary>
    public const int Lines = 5;

    public static IReadOnlyList<string> Render(PartRecord part, bool qualify)
    {
        var (value, u) = UncertaintyRounding.Round(part.Value, part.Measured.Expanded);
        var k = part.Measured.CoverageFactor.ToString("0.##", CultureInfo.InvariantCulture);
        var temperature = part.Temperature is { } t ? "at " + Format.Celsius(t) + " degC" : "";
        return
        [
            Spread("#" + part.Id.ToString(CultureInfo.InvariantCulture), OhmsText.Nominal(part.Nominal)),
            Fit($"R {value} Ohm"),
            Fit($"U {u} Ohm (k={k})"),
            Spread($"dev {Format.Ppm(part.DeviationPpm)} ppm", temperature),
            Fit($"{Format.Date(part.AcceptedAt)}  {PartWhere.Of(part, qualify)}"),
        ];
    }

    // Left text, right text, padded between; the right part gives way when both do not fit.
    private static string Spread(string left, string right)
    {
        var gap = Width - left.Length - right.Length;
        return gap >= 1 ? left + new string(' ', gap) + right : Fit(left + " " + right);
    }

    // Exactly Width characters: ASCII only (anything else becomes '?'), cut with '~' when too long.
    private static string Fit(string text)
    {
        var ascii = new string(text.Select(c => c is >= ' ' and <= '~' ? c : '?').ToArray());
        return ascii.Length <= Width ? ascii.PadRight(Width) : ascii[..(Width - 1)] + "~";
    }
}
