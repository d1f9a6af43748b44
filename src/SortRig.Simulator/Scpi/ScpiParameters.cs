using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// Parameter decoding (IEEE 488.2 sec. 7.7): NRf numbers with suffixes, MIN/MAX/DEF, booleans and
/// keywords. Character data where a number is expected is -104; an unknown keyword is -224.
/// </summary>
internal static partial class ScpiParameters
{
    public static double Number(string text, NumericParameter spec)
    {
        var match = NumberShape().Match(text);
        if (match.Success)
        {
            var value = double.Parse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture);
            var suffix = match.Groups[2].Value;
            if (suffix.Length == 0)
            {
                return value;
            }

            return spec.Suffixes.TryGetValue(suffix, out var scale)
                ? value * scale
                : throw new ScpiException(ScpiError.InvalidSuffix);
        }

        double? keyword =
            IsKeyword(text, "MINimum") ? spec.Min
            : IsKeyword(text, "MAXimum") ? spec.Max
            : IsKeyword(text, "DEFault") ? spec.Default
            : null;
        return keyword ?? throw new ScpiException(ScpiError.DataType);
    }

    public static bool Boolean(string text)
    {
        if (IsKeyword(text, "ON"))
        {
            return true;
        }

        if (IsKeyword(text, "OFF"))
        {
            return false;
        }

        return NumberShape().IsMatch(text)
            ? Math.Round(Number(text, NumericParameter.Plain)) != 0
            : throw new ScpiException(ScpiError.IllegalParameterValue);
    }

    public static string Keyword(string text, params string[] mnemonics)
    {
        if (!CharacterData().IsMatch(text))
        {
            throw new ScpiException(ScpiError.DataType);
        }

        return mnemonics.FirstOrDefault(m => IsKeyword(text, m))
            ?? throw new ScpiException(ScpiError.IllegalParameterValue);
    }

    public static bool IsKeyword(string text, string mnemonic) => new Mnemonic(mnemonic).Matches(text);

    [GeneratedRegex(@"^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-z]*)$")]
    private static partial Regex NumberShape();

    [GeneratedRegex(@"^[A-Za-z][A-Za-z0-9_]*$")]
    private static partial Regex CharacterData();
}
