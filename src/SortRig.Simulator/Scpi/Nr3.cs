using System.Globalization;

namespace SortRig.Simulator.Scpi;

/// <summary>Reply formatting: NR3 numbers like +1.00012345E+04 (IEEE 488.2 sec. 8.7.4), NR1 integers.</summary>
internal static class Nr3
{
    /// <summary>The not-a-number value as a reading reply carries it (SCPI-99 vol. 1 sec. 7.2.1.5: 9.91E37).</summary>
    public static readonly string NotANumber = Format(9.91e37);

    public static string Format(double value)
    {
        var text = value.ToString("E8", CultureInfo.InvariantCulture); // e.g. 1.00012345E+004
        var e = text.IndexOf('E', StringComparison.Ordinal);
        var mantissa = text[..e];
        var exponent = int.Parse(text[(e + 1)..], NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture);
        var sign = mantissa.StartsWith('-') ? string.Empty : "+";
        var expSign = exponent < 0 ? "-" : "+";
        return $"{sign}{mantissa}E{expSign}{Math.Abs(exponent):D2}";
    }

    public static string FormatList(IEnumerable<double> values) => string.Join(',', values.Select(Format));

    public static string Format(bool value) => value ? "1" : "0";

    public static string Format(int value) => value.ToString(CultureInfo.InvariantCulture);
}
