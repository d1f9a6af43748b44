using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>
/// An independent statement of what ScpiNumber must accept: the IEEE 488.2 sec. 7.7.2.2 NRf
/// grammar (mantissa with optional sign and point, optional exponent; white space allowed around
/// the exponent letter; from memory) written as a regular expression, valued by .NET's invariant
/// double parser (general-purpose reference library).
/// </summary>
internal static partial class NrfOracle
{
    /// <summary>ScpiNumber's own documented limit on the trimmed text (longer text is refused).</summary>
    public const int MaxLength = 256;

    /// <summary>What ScpiNumber.Parse should give for <paramref name="text"/>: null when it must refuse it.</summary>
    public static ScpiNumber? Expected(string text)
    {
        var trimmed = text.Trim();
        if (trimmed.Length is 0 or > MaxLength || !Nrf().IsMatch(trimmed))
        {
            return null;
        }

        var compact = trimmed
            .Replace(" ", string.Empty, StringComparison.Ordinal)
            .Replace("\t", string.Empty, StringComparison.Ordinal);
        var value = double.Parse(compact, NumberStyles.Float, CultureInfo.InvariantCulture);
        if (!double.IsFinite(value))
        {
            return null;
        }

        var format =
            compact.Contains('E', StringComparison.OrdinalIgnoreCase) ? ScpiNumberFormat.NR3
            : compact.Contains('.', StringComparison.Ordinal) ? ScpiNumberFormat.NR2
            : ScpiNumberFormat.NR1;
        return new ScpiNumber(value, format);
    }

    /// <summary>Distance in units in the last place between two finite doubles (0 for +0 and -0).</summary>
    public static long Ulps(double a, double b)
    {
        static long Ordered(double d)
        {
            var bits = BitConverter.DoubleToInt64Bits(d);
            return bits < 0 ? long.MinValue - bits : bits;
        }

        return Math.Abs(Ordered(a) - Ordered(b));
    }

    // ASCII digits only ([0-9], not \d, which matches any Unicode digit) and \z, not $ (which allows a final \n).
    [GeneratedRegex(
        @"\A[+-]?(?:[0-9]+\.?[0-9]*|\.[0-9]+)(?:[ \t]*[Ee][ \t]*[+-]?[0-9]+)?\z",
        RegexOptions.CultureInvariant
    )]
    private static partial Regex Nrf();
}
