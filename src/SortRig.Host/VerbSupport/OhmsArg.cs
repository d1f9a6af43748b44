using System.Globalization;
using SortRig.Host.LibraryVerb;
using SortRig.Storage.Contracts;

namespace SortRig.Host.VerbSupport;

/// <summary>Parses a resistance option: "10000", "10k", "4.99k", "1M", "100R".</summary>
internal static class OhmsArg
{
    public static double? ParseOptional(string? text, string option) =>
        string.IsNullOrWhiteSpace(text) ? null : Parse(text, option);

    public static double Parse(string text, string option)
    {
        var t = text.Trim();
        var scale =
            t.Length == 0
                ? 0
                : t[^1] switch
                {
                    'k' or 'K' => 1e3,
                    'M' => 1e6,
                    'R' or 'r' => 1.0,
                    _ => 0.0,
                };
        var digits = scale == 0.0 ? t : t[..^1];
        var ohms = double.TryParse(digits, NumberStyles.Float, CultureInfo.InvariantCulture, out var x)
            ? x * (scale == 0.0 ? 1 : scale)
            : double.NaN;
        return ohms > 0 && double.IsFinite(ohms)
            ? ohms
            : throw new VerbException(
                $"{option}: '{text}' is not a resistance in ohms > 0 (e.g. 10000, 10k, 4.99k, 1M)"
            );
    }
}
