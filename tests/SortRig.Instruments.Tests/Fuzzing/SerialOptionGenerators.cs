using System.IO.Ports;
using FsCheck;
using FsCheck.Fluent;
using SortRig.Instruments.Resources;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>One "key=value" serial option and what it sets.</summary>
internal sealed record SerialOptionText(string Text, Func<SerialOverrides, SerialOverrides> Apply);

/// <summary>Generators of the ASRL "?key=value&amp;..." options (our extension, docs/instruments.md), keys and values
/// in random case.</summary>
internal static class SerialOptionGenerators
{
    /// <summary>One generator per option key; a resource takes each key at most once.</summary>
    public static readonly Gen<SerialOptionText>[] All =
    [
        Option(
            "baud",
            Gen.Choose(50, 4_000_000).Select(b => (b.ToString(System.Globalization.CultureInfo.InvariantCulture), b)),
            (s, b) => s with { BaudRate = b }
        ),
        Option(
            "parity",
            Gen.Elements(
                ("none", Parity.None),
                ("odd", Parity.Odd),
                ("even", Parity.Even),
                ("mark", Parity.Mark),
                ("space", Parity.Space)
            ),
            (s, p) => s with { Parity = p }
        ),
        Option(
            "data",
            Gen.Choose(5, 8).Select(d => (d.ToString(System.Globalization.CultureInfo.InvariantCulture), d)),
            (s, d) => s with { DataBits = d }
        ),
        Option("stop", Gen.Elements(("1", StopBits.One), ("1.5", StopBits.OnePointFive), ("2", StopBits.Two)), (s, b) =>
            s with
            {
                StopBits = b,
            }
        ),
        Option(
            "flow",
            Gen.Elements(
                ("none", Handshake.None),
                ("rts", Handshake.RequestToSend),
                ("xon", Handshake.XOnXOff),
                ("rts-xon", Handshake.RequestToSendXOnXOff)
            ),
            (s, h) => s with { Handshake = h }
        ),
    ];

    private static Gen<SerialOptionText> Option<T>(
        string key,
        Gen<(string Text, T Value)> values,
        Func<SerialOverrides, T, SerialOverrides> set
    ) =>
        from value in values
        from upperKey in Gen.Elements(false, false, true)
        from upperValue in Gen.Elements(false, false, true)
        select new SerialOptionText(
            $"{(upperKey ? key.ToUpperInvariant() : key)}={(upperValue ? value.Text.ToUpperInvariant() : value.Text)}",
            s => set(s, value.Value)
        );
}
