using System.Globalization;
using System.IO.Ports;

namespace SortRig.Instruments.Resources;

/// <summary>
/// Parses the serial options after '?' in an ASRL resource (our extension), e.g.
/// "?baud=9600&amp;parity=even&amp;data=7&amp;stop=2&amp;flow=xon".
/// </summary>
internal static class SerialOptionParser
{
    private const string OptionKeys = "baud, parity, data, stop or flow";

    public static SerialOverrides Parse(ResourceParts parts)
    {
        var result = SerialOverrides.None;
        if (parts.Options is null)
        {
            return result;
        }

        var seen = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        var offset = parts.OptionsOffset;
        var items = parts.Options.Split('&');
        for (var i = 0; i < items.Length; i++)
        {
            var item = items[i];
            var eq = item.IndexOf('=', StringComparison.Ordinal);
            var key = eq < 0 ? item : item[..eq];
            var value = eq < 0 ? string.Empty : item[(eq + 1)..].ToLowerInvariant();
            ResourceStringException Bad(string expected) =>
                new(parts.Text, i + 1, item, offset, $"is not {expected}", expected, isOption: true);
            if (!seen.Add(key))
            {
                throw new ResourceStringException(
                    parts.Text,
                    i + 1,
                    item,
                    offset,
                    "repeats an option given before",
                    "each option once",
                    isOption: true
                );
            }

            result = key.ToLowerInvariant() switch
            {
                "baud" => result with
                {
                    BaudRate = Int(value, 50, 4_000_000) ?? throw Bad("baud=<bits per second 50-4000000>"),
                },
                "parity" => result with { Parity = ParseParity(value) ?? throw Bad("parity=none|odd|even|mark|space") },
                "data" => result with { DataBits = Int(value, 5, 8) ?? throw Bad("data=5|6|7|8") },
                "stop" => result with { StopBits = ParseStop(value) ?? throw Bad("stop=1|1.5|2") },
                "flow" => result with { Handshake = ParseFlow(value) ?? throw Bad("flow=none|rts|xon|rts-xon") },
                _ => throw Bad($"a serial option key=value with key {OptionKeys}"),
            };
            offset += item.Length + 1;
        }

        return result;
    }

    private static int? Int(string text, int min, int max) =>
        int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out var v) && v >= min && v <= max
            ? v
            : null;

    private static Parity? ParseParity(string v) =>
        v switch
        {
            "none" => Parity.None,
            "odd" => Parity.Odd,
            "even" => Parity.Even,
            "mark" => Parity.Mark,
            "space" => Parity.Space,
            _ => null,
        };

    private static StopBits? ParseStop(string v) =>
        v switch
        {
            "1" => StopBits.One,
            "1.5" => StopBits.OnePointFive,
            "2" => StopBits.Two,
            _ => null,
        };

    private static Handshake? ParseFlow(string v) =>
        v switch
        {
            "none" => Handshake.None,
            "rts" => Handshake.RequestToSend,
            "xon" => Handshake.XOnXOff,
            "rts-xon" => Handshake.RequestToSendXOnXOff,
            _ => null,
        };
}
