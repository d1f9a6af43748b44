using System.IO.Ports;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Profiles;

/// <summary>Reads the "comms" mapping: transports, terminator, query timeout, serial defaults.</summary>
internal static class CommsSectionReader
{
    private static readonly string[] s_keys = ["transports", "terminator", "query_timeout_s", "serial"];
    private static readonly string[] s_serialKeys = ["baud", "parity", "data_bits", "stop_bits", "handshake"];

    private static readonly Dictionary<string, TransportKind> s_transports = new(StringComparer.Ordinal)
    {
        ["tcp-socket"] = TransportKind.TcpSocket,
        ["serial"] = TransportKind.Serial,
        ["usbtmc"] = TransportKind.UsbTmc,
        ["simulator"] = TransportKind.Simulator,
    };

    public static MeterComms Read(YamlField field)
    {
        var map = field.AsMap(s_keys);
        var transports = new List<TransportKind>();
        foreach (
            var item in map.Required("transports", "a list of tcp-socket, serial, usbtmc, simulator")
                .AsList(minCount: 1)
        )
        {
            var name = item.AsString();
            if (!s_transports.TryGetValue(name, out var kind))
            {
                throw item.Error($"unknown transport '{name}'", "tcp-socket, serial, usbtmc or simulator");
            }

            if (transports.Contains(kind))
            {
                throw item.Error($"'{name}' is listed twice", "each transport at most once");
            }

            transports.Add(kind);
        }

        var terminatorField = map.Required("terminator", "\"\\n\", \"\\r\\n\" or \"\\r\"");
        var terminator = terminatorField.AsString();
        if (terminator is not ("\n" or "\r\n" or "\r"))
        {
            throw terminatorField.Error(
                "is not a line terminator",
                "\"\\n\", \"\\r\\n\" or \"\\r\" (in double quotes)"
            );
        }

        var timeout = map.Optional("query_timeout_s")?.AsDouble(0.01, 600, " s") ?? 5.0;
        var serial = map.Optional("serial") is { } s ? ReadSerial(s) : null;
        return new MeterComms(transports, terminator, TimeSpan.FromSeconds(timeout), serial);
    }

    private static SerialSettings ReadSerial(YamlField field)
    {
        var map = field.AsMap(s_serialKeys);
        var baud = map.Required("baud", "bits per second").AsInt(50, 4_000_000, " baud");
        var parity = Pick(
            map.Required("parity", "none, odd, even, mark or space"),
            "none, odd, even, mark or space",
            v =>
                v switch
                {
                    "none" => Parity.None,
                    "odd" => Parity.Odd,
                    "even" => Parity.Even,
                    "mark" => Parity.Mark,
                    "space" => Parity.Space,
                    _ => (Parity?)null,
                }
        );
        var dataBits = map.Required("data_bits", "5 to 8").AsInt(5, 8, " bits");
        var stopBits = Pick(map.Required("stop_bits", "1, 1.5 or 2"), "1, 1.5 or 2", v => v switch
            {
                "1" => StopBits.One,
                "1.5" => StopBits.OnePointFive,
                "2" => StopBits.Two,
                _ => (StopBits?)null,
            });
        var handshake = Pick(map.Required("handshake", "none, rts, xon or rts-xon"), "none, rts, xon or rts-xon", v =>
            v switch
            {
                "none" => Handshake.None,
                "rts" => Handshake.RequestToSend,
                "xon" => Handshake.XOnXOff,
                "rts-xon" => Handshake.RequestToSendXOnXOff,
                _ => (Handshake?)null,
            }
        );
        return new SerialSettings(baud, parity, dataBits, stopBits, handshake);
    }

    private static T Pick<T>(YamlField field, string expected, Func<string, T?> map)
        where T : struct =>
        map(field.AsString()) ?? throw field.Error($"'{field.AsString()}' is not allowed", expected);
}
