using System.CommandLine.Parsing;
using System.Globalization;

namespace SortRig.Host.Cli;

/// <summary>
/// Parses option values the way the trade writes them: resistances with a multiplier suffix
/// ("10k", "4.99k", "1M", "100R") and tolerances as a fraction, a percentage or ppm
/// ("0.001", "0.1%", "1000ppm"). A value that does not parse becomes a parse error naming the
/// option as the user typed it.
/// </summary>
internal static class TradeValueParser
{
    /// <summary>A resistance in ohms &gt; 0: plain number or k/M/R suffix.</summary>
    public static double Ohms(ArgumentResult result)
    {
        var text = Single(result);
        return TryOhms(text, out var ohms)
            ? ohms
            : Fail(result, $"'{text}' is not a resistance in ohms (e.g. 10000, 10k, 4.99k, 1M)");
    }

    /// <summary>A dimensionless fraction: "0.001", "0.1%" or "1000ppm" all mean 0.001.</summary>
    public static double Fraction(ArgumentResult result)
    {
        var text = Single(result);
        return TryFraction(text, out var fraction)
            ? fraction
            : Fail(result, $"'{text}' is not a tolerance (e.g. 0.001, 0.1%, 1000ppm)");
    }

    /// <summary>
    /// "10k" → 10 000; "4.99k" → 4 990; "1M" → 1e6; "100R" → 100; also the letter as decimal marker
    /// ("4k99" → 4 990, "R47" → 0.47); false when not a positive finite value.
    /// </summary>
    public static bool TryOhms(string text, out double ohms)
    {
        var t = text.Trim();
        var at = t.IndexOfAny(['R', 'r', 'k', 'K', 'M', 'G']);
        var scale =
            at < 0
                ? 1.0
                : t[at] switch
                {
                    'k' or 'K' => 1e3,
                    'M' => 1e6,
                    'G' => 1e9,
                    _ => 1.0,
                };
        var digits =
            at < 0 ? t
            : at == t.Length - 1 ? t[..at]
            : t[..at].Contains('.', StringComparison.Ordinal) || t[(at + 1)..].Contains('.', StringComparison.Ordinal)
                ? "x"
            : (at == 0 ? "0" : t[..at]) + "." + t[(at + 1)..];
        ohms =
            digits.Length > 0 && double.TryParse(digits, NumberStyles.Float, CultureInfo.InvariantCulture, out var x)
                ? x * scale
                : double.NaN;
        return ohms > 0 && double.IsFinite(ohms);
    }

    /// <summary>"0.001" → 0.001; "0.1%" → 0.001; "1000ppm" → 0.001; false when not a finite number.</summary>
    public static bool TryFraction(string text, out double fraction)
    {
        var t = text.Trim();
        var scale = 1.0;
        if (t.EndsWith("ppm", StringComparison.OrdinalIgnoreCase))
        {
            (t, scale) = (t[..^3], 1e-6);
        }
        else if (t.EndsWith('%'))
        {
            (t, scale) = (t[..^1], 1e-2);
        }

        fraction = double.TryParse(t.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var x)
            ? x * scale
            : double.NaN;
        return double.IsFinite(fraction);
    }

    private static string Single(ArgumentResult result) => result.Tokens.Count == 1 ? result.Tokens[0].Value : "";

    private static double Fail(ArgumentResult result, string message)
    {
        var name = result.Parent is OptionResult o ? o.Option.Name : "value";
        result.AddError($"{name}: {message}");
        return 0;
    }
}
