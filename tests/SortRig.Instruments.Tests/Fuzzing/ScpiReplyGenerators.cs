using FsCheck;
using FsCheck.Fluent;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>A SYST:ERR? reply built from a known code and message.</summary>
internal sealed record ErrorReply(int Code, string Message, string Text)
{
    /// <inheritdoc/>
    public override string ToString() => $"'{TextEdit.Escaped(Text)}'";
}

/// <summary>A *IDN? reply built from known fields.</summary>
internal sealed record IdentityReply(string Manufacturer, string Model, string Serial, string Firmware, string Text)
{
    /// <inheritdoc/>
    public override string ToString() => $"'{TextEdit.Escaped(Text)}'";
}

/// <summary>Generators of SYST:ERR? and *IDN? replies, valid and damaged.</summary>
internal static class ScpiReplyGenerators
{
    /// <summary>The punctuation of both reply forms.</summary>
    public const string Syntax = ",\"'-+0123456789 ";

    private static readonly Gen<string> s_pad = Gen.Elements(string.Empty, string.Empty, " ", "  ", "\t");

    /// <summary>
    /// Error entries: codes of SCPI-99 vol. 2 ch. 21 (-113 undefined header, -222 data out of range, ...;
    /// from memory) or any int, and messages with commas and quotes, written as code,"text" with each
    /// quote doubled (SCPI-99 vol. 2 sec. 21.8 / IEEE 488.2 string response data, from memory).
    /// </summary>
    public static Gen<ErrorReply> ValidError =>
        from code in Gen.Frequency(
            (
                3,
                Gen.Elements(
                    0,
                    -100,
                    -102,
                    -113,
                    -200,
                    -221,
                    -222,
                    -224,
                    -230,
                    -310,
                    -350,
                    -363,
                    -410,
                    -420,
                    -440,
                    101,
                    304
                )
            ),
            (2, Gen.Choose(int.MinValue, int.MaxValue))
        )
        from plus in Gen.Elements(false, true)
        from message in Text(" ,;:\"'()-_.")
        from pad in s_pad
        select new ErrorReply(
            code,
            message,
            $"{(plus && code >= 0 ? "+" : string.Empty)}{code},{pad}\""
                + $"{message.Replace("\"", "\"\"", StringComparison.Ordinal)}\"{pad}"
        );

    /// <summary>Identities: fields without commas (the model not blank), firmware possibly with commas,
    /// padded.</summary>
    public static Gen<IdentityReply> ValidIdentity =>
        from maker in Text(" .-_/")
        from model in Text(" .-_/").Where(m => m.Trim().Length > 0)
        from serial in Text(" .-_/")
        from firmware in Text(" .-_/,")
        from pad in s_pad
        select new IdentityReply(
            maker.Trim(),
            model.Trim(),
            serial.Trim(),
            firmware.Trim(),
            $"{pad}{maker}{pad},{model},{pad}{serial},{firmware}{pad}"
        );

    /// <summary>Arbitrary text, damaged valid error replies, and valid ones.</summary>
    public static Gen<string> AnyError =>
        Gen.Frequency(
            (2, TextMutations.Arbitrary(Syntax)),
            (3, TextMutations.Mutate(ValidError.Select(e => e.Text), Syntax).Select(m => m.Text)),
            (1, ValidError.Select(e => e.Text))
        );

    /// <summary>Arbitrary text, damaged valid identities, and valid ones.</summary>
    public static Gen<string> AnyIdentity =>
        Gen.Frequency(
            (2, TextMutations.Arbitrary(Syntax)),
            (3, TextMutations.Mutate(ValidIdentity.Select(e => e.Text), Syntax).Select(m => m.Text)),
            (1, ValidIdentity.Select(e => e.Text))
        );

    private static Gen<string> Text(string punctuation) =>
        Gen.Choose(0, 24)
            .SelectMany(n =>
                Gen.ArrayOf(
                    Gen.Frequency(
                        (8, Gen.Elements("ABCXYZabcxyz0123456789".ToCharArray())),
                        (3, Gen.Elements(punctuation.ToCharArray())),
                        (1, Gen.Elements(TextMutations.Awkward.Where(c => c != ',').ToArray()))
                    ),
                    n
                )
            )
            .Select(a => new string(a));
}
