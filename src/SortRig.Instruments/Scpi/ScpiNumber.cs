using System.Globalization;

namespace SortRig.Instruments.Scpi;

/// <summary>Which IEEE 488.2 numeric response form a number was written in (sec. 8.7.2-8.7.4).</summary>
public enum ScpiNumberFormat
{
    /// <summary>Integer, e.g. "-17" or "+5".</summary>
    NR1 = 1,

    /// <summary>Fixed point with a decimal point, e.g. "12.5" or ".5".</summary>
    NR2 = 2,

    /// <summary>Floating point with an exponent, e.g. "+1.0005E+04".</summary>
    NR3 = 3,
}

/// <summary>
/// A decimal number as an instrument sends it (IEEE 488.2 sec. 7.7.2 NRf grammar: NR1, NR2 and
/// NR3; white space allowed before and after the exponent letter), with the SCPI-99 special
/// values: 9.9E37 overflow (+infinity), -9.9E37 (-infinity) and 9.91E37 not-a-number.
/// </summary>
/// <param name="Value">The value as written (9.9E37 stays 9.9E37).</param>
/// <param name="Format">The form it was written in.</param>
public readonly record struct ScpiNumber(double Value, ScpiNumberFormat Format)
{
    /// <summary>SCPI-99 vol. 1 sec. 7.2.1: the value meaning +infinity / overflow.</summary>
    public const double Overflow = 9.9e37;

    /// <summary>SCPI-99 vol. 1 sec. 7.2.1: the value meaning not-a-number.</summary>
    public const double NotANumber = 9.91e37;

    /// <summary>True for 9.9E37 (over range, open input).</summary>
    public bool IsOverflow => Value == Overflow;

    /// <summary>True for -9.9E37 (negative infinity).</summary>
    public bool IsNegativeOverflow => Value == -Overflow;

    /// <summary>True for 9.91E37.</summary>
    public bool IsNotANumber => Value == NotANumber;

    /// <summary>True for an ordinary finite value (none of the special values).</summary>
    public bool IsOrdinary => !IsOverflow && !IsNegativeOverflow && !IsNotANumber;

    /// <summary>Parses <paramref name="text"/>; leading and trailing white space is ignored.</summary>
    /// <exception cref="FormatException">The text is not an NR1, NR2 or NR3 number.</exception>
    public static ScpiNumber Parse(string text) =>
        TryParse(text, out var n)
            ? n
            : throw new FormatException($"'{text}' is not an IEEE 488.2 decimal number (NR1, NR2 or NR3)");

    /// <summary>Parses <paramref name="text"/> without throwing.</summary>
    public static bool TryParse(ReadOnlySpan<char> text, out ScpiNumber number)
    {
        number = default;
        var s = text.Trim();
        var i = 0;
        Span<char> compact = stackalloc char[Math.Min(s.Length, 256) + 1];
        var n = 0;
        if (s.Length == 0 || s.Length > 256)
        {
            return false;
        }

        if (s[i] is '+' or '-')
        {
            compact[n++] = s[i++];
        }

        var digits = CopyDigits(s, ref i, compact, ref n);
        var hasPoint = i < s.Length && s[i] == '.';
        if (hasPoint)
        {
            compact[n++] = s[i++];
            digits += CopyDigits(s, ref i, compact, ref n);
        }

        if (digits == 0)
        {
            return false;
        }

        var format = hasPoint ? ScpiNumberFormat.NR2 : ScpiNumberFormat.NR1;
        SkipWhite(s, ref i);
        if (i < s.Length && s[i] is 'E' or 'e')
        {
            compact[n++] = 'E';
            i++;
            SkipWhite(s, ref i);
            if (i < s.Length && s[i] is '+' or '-')
            {
                compact[n++] = s[i++];
            }

            if (CopyDigits(s, ref i, compact, ref n) == 0)
            {
                return false;
            }

            format = ScpiNumberFormat.NR3;
        }

        if (
            i != s.Length
            || !double.TryParse(compact[..n], NumberStyles.Float, CultureInfo.InvariantCulture, out var value)
            || !double.IsFinite(value)
        )
        {
            return false;
        }

        number = new ScpiNumber(value, format);
        return true;
    }

    private static int CopyDigits(ReadOnlySpan<char> s, ref int i, Span<char> to, ref int n)
    {
        var start = i;
        while (i < s.Length && char.IsAsciiDigit(s[i]))
        {
            to[n++] = s[i++];
        }

        return i - start;
    }

    private static void SkipWhite(ReadOnlySpan<char> s, ref int i)
    {
        while (i < s.Length && s[i] is ' ' or '\t')
        {
            i++;
        }
    }
}
