using System.Globalization;
using FsCheck;
using FsCheck.Fluent;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>A number and one text form of it; <see cref="RoundTrip"/> when the form keeps every bit.</summary>
internal sealed record NumberText(double Value, string Text, bool RoundTrip)
{
    /// <inheritdoc/>
    public override string ToString() => $"{Value:R} as '{TextEdit.Escaped(Text)}'";
}

/// <summary>Generators of decimal numbers as instruments write them, and of damaged ones.</summary>
internal static class ScpiNumberGenerators
{
    /// <summary>The characters of number syntax, weighted into inserted text.</summary>
    public const string Syntax = "0123456789+-.Ee \t";

    /// <summary>
    /// Finite doubles: arbitrary bit patterns (every exponent, subnormals, -0), bench-like readings,
    /// and the SCPI-99 vol. 1 sec. 7.2.1 special values 9.9E37, -9.9E37 and 9.91E37.
    /// </summary>
    public static Gen<double> Finite =>
        Gen.Frequency(
            (
                4,
                Gen.Zip(Gen.Choose(int.MinValue, int.MaxValue), Gen.Choose(int.MinValue, int.MaxValue))
                    .Select(p => BitConverter.Int64BitsToDouble(((long)p.Item1 << 32) | (uint)p.Item2))
                    .Where(double.IsFinite)
            ),
            (
                4,
                Gen.Zip(Gen.Choose(-2_000_000_000, 2_000_000_000), Gen.Choose(-12, 9))
                    .Select(p => p.Item1 * Math.Pow(10, p.Item2))
            ),
            (1, Gen.Elements(9.9e37, -9.9e37, 9.91e37, 0.0, -0.0, double.Epsilon, double.MaxValue, double.MinValue))
        );

    /// <summary>A finite double written as NR1, NR2 or NR3 text, with the cosmetic freedoms IEEE 488.2
    /// allows.</summary>
    public static Gen<NumberText> Valid =>
        from value in Finite
        from format in Gen.Elements("R", "G17", "E16", "E", "E0", "E3", "E8", "F0", "F4", "F12", "NR3", "NR1")
        from plus in Gen.Elements(false, true)
        from lowerE in Gen.Elements(false, true)
        from spaceE in Gen.Elements(string.Empty, string.Empty, " ", "\t", "  ")
        from pad in Gen.Elements(string.Empty, string.Empty, " ", "\t", "\r\n", "\u00A0")
        select Write(value, format, plus, lowerE, spaceE, pad);

    /// <summary>Valid numbers damaged by inserted, deleted or replaced characters, or by a typical
    /// corruption.</summary>
    public static Gen<Mutated> NearValid =>
        Gen.Frequency(
            (3, TextMutations.Mutate(Valid.Select(n => n.Text), Syntax)),
            (2, from n in Valid from damage in Damage select new Mutated(n.Text, damage(n.Text), "typical corruption"))
        );

    private static Gen<Func<string, string>> Damage =>
        Gen.Elements<Func<string, string>>(
            t => "+" + t,
            t => "--" + t.TrimStart('+', '-'),
            t => t + "E+400",
            t => t + "E-400",
            t => t + "E99999999999",
            t => t.Replace("E", "EE", StringComparison.Ordinal),
            t => new string('7', 300) + t,
            t => "1." + new string('3', 250),
            t => t.Replace('1', '\u0661').Replace('5', '\uFF15'),
            t => t + "\0",
            t => t.Insert(t.Length / 2, "\0"),
            t => t.Replace(".", ",", StringComparison.Ordinal),
            _ => "NaN",
            _ => "-Infinity",
            _ => "INF",
            _ => "9.9E37 ",
            t => t + "\n" + t,
            t => t + " V"
        );

    private static NumberText Write(double value, string format, bool plus, bool lowerE, string spaceE, string pad)
    {
        var inv = CultureInfo.InvariantCulture;
        format = Math.Abs(value) > 1e308 ? "R" : format; // fewer digits would round 1.797E308 up to infinity
        var text = format switch
        {
            // Sign written by hand: .NET's two-section custom format writes -0.0 as "-+0.00000000E+00".
            "NR3" => (double.IsNegative(value) ? "-" : "+") + Math.Abs(value).ToString("0.00000000E+00", inv),
            "NR1" => Math.Abs(value) < 1e15 ? Math.Round(value).ToString("F0", inv) : value.ToString("R", inv),
            ['F', ..] when Math.Abs(value) >= 1e20 => value.ToString("R", inv),
            _ => value.ToString(format, inv),
        };
        var exact = format is "R" or "G17" or "E16" || (format == "NR1" && Math.Abs(value) >= 1e15);
        var number = format == "NR1" && Math.Abs(value) < 1e15 ? Math.Round(value) : value;
        text = text.Replace("E", (spaceE + (lowerE ? "e" : "E")) + spaceE, StringComparison.Ordinal);
        text = plus && text[0] is not ('-' or '+') ? "+" + text : text;
        return new NumberText(number, pad + text + pad, exact);
    }
}
