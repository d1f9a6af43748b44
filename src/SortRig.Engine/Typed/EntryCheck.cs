using System.Globalization;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;
using static System.FormattableString;

namespace SortRig.Engine.Typed;

/// <summary>
/// Checks a value the operator typed off the display before it reaches the settle rule or the log. A bare number
/// is in the display's unit on the selected range (the 50 kOhm range shows kOhm: "10.003" is 10 003 Ohm); the trade's
/// notation is accepted too: "10.003k", "10k003", "4k99", "470R", "1M2". Refused, each with one plain line asking to
/// re-enter: nothing typed, letters or signs, two decimal points, more digits than the display shows, zero, a value
/// above what the range shows, and a value about 10 times away from the nominal (a misplaced decimal point).
/// </summary>
public static class EntryCheck
{
    private static readonly double s_decade = Math.Sqrt(10);

    /// <summary>Checks <paramref name="text"/> typed while <paramref name="range"/> is set, for a batch of <paramref
    /// name="nominal"/> ohms.</summary>
    public static EntryVerdict Check(string? text, DisplayRange range, double nominal)
    {
        ArgumentNullException.ThrowIfNull(range);
        var t = StripUnit((text ?? "").Trim()).Replace(" ", "", StringComparison.Ordinal);
        var example = Example(range, nominal);
        if (t.Length == 0)
        {
            return EntryVerdict.Refuse($"nothing typed: type the value on the display, e.g. {example}");
        }

        if (t.Count(c => c == '.') > 1)
        {
            return EntryVerdict.Refuse($"'{text}' has two decimal points: re-enter the display, e.g. {example}");
        }

        var letters = t.Where(c => !char.IsAsciiDigit(c) && c != '.').ToArray();
        if (letters.Length > 1 || (letters.Length == 1 && Multiplier(letters[0]) is null))
        {
            return EntryVerdict.Refuse(
                $"'{text}' has letters or signs in it: type only the digits of the display, e.g. {example}"
            );
        }

        if (letters.Length == 1 && t.Contains('.', StringComparison.Ordinal) && t[^1] != letters[0])
        {
            return EntryVerdict.Refuse(
                $"'{text}' has two decimal points (a '.' and a letter in the middle): re-enter, e.g. {example}"
            );
        }

        if (!TryValue(t, range, out var ohms))
        {
            return EntryVerdict.Refuse($"'{text}' is not a number: re-enter the display, e.g. {example}");
        }

        return Judge(text!, ohms, range, nominal, example);
    }

    private static EntryVerdict Judge(string text, double ohms, DisplayRange range, double nominal, string example)
    {
        if (!(ohms > 0))
        {
            return EntryVerdict.Refuse($"'{text}' is zero: a part reads above zero; re-enter, e.g. {example}");
        }

        if (ohms > range.DisplayMax * (1 + 1e-9))
        {
            return EntryVerdict.Refuse(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"'{text}' ({OhmsText.Format(ohms, 6)}) is above what the {range.Name} range shows ("
                        + $"{range.Show(range.DisplayMax)}): re-enter; if the meter shows OL the part is open or not "
                        + $"this value"
                )
            );
        }

        var steps = ohms / range.Step;
        if (Math.Abs(steps - Math.Round(steps)) > 1e-6 * Math.Max(1, steps))
        {
            return EntryVerdict.Refuse(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"'{text}' has more digits than the {range.Name} range shows (one digit = "
                        + $"{range.Show(range.Step)}): re-enter the display as shown"
                )
            );
        }

        var ratio = ohms / nominal;
        if (ratio >= s_decade || ratio <= 1 / s_decade)
        {
            var times = ratio >= 1 ? ratio : 1 / ratio;
            return EntryVerdict.Refuse(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"'{text}' ({OhmsText.Format(ohms, 6)}) is {times:0.#} times {(ratio >= 1 ? "above" : "below")} "
                        + $"the nominal {OhmsText.Nominal(nominal)}: a misplaced decimal point? re-enter, e.g. "
                        + $"{example}; a part that really reads this is not from this reel"
                )
            );
        }

        return EntryVerdict.Value(Math.Round(steps) * range.Step);
    }

    private static bool TryValue(string t, DisplayRange range, out double ohms)
    {
        var at = t.IndexOfAny(['R', 'r', 'k', 'K', 'm', 'M']);
        double scale;
        string digits;
        if (at < 0)
        {
            (scale, digits) = (range.UnitScale, t);
        }
        else
        {
            scale = Multiplier(t[at])!.Value;
            digits = at == t.Length - 1 ? t[..at] : (at == 0 ? "0" : t[..at]) + "." + t[(at + 1)..];
        }

        ohms = double.NaN;
        if (
            digits.Length == 0
            || digits == "."
            || !double.TryParse(digits, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var x)
        )
        {
            return false;
        }

        ohms = x * scale;
        return double.IsFinite(ohms);
    }

    // 'm' is taken as mega: a hand-held shows no milliohms on a resistance range, and a typist often misses the shift
    // key.
    private static double? Multiplier(char c) =>
        c switch
        {
            'R' or 'r' => 1,
            'k' or 'K' => 1e3,
            'M' or 'm' => 1e6,
            _ => null,
        };

    private static string StripUnit(string t)
    {
        foreach (var unit in (string[])["ohms", "ohm", "Ω"])
        {
            if (t.EndsWith(unit, StringComparison.OrdinalIgnoreCase))
            {
                return t[..^unit.Length].TrimEnd();
            }
        }

        return t;
    }

    private static string Example(DisplayRange range, double nominal) =>
        Invariant($"{range.Show(Math.Min(nominal, range.DisplayMax)).Split(' ')[0]} (in {range.UnitName})");
}
