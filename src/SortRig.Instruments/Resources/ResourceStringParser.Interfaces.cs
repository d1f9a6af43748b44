using System.Globalization;

namespace SortRig.Instruments.Resources;

/// <summary>The parts after the interface keyword, per interface.</summary>
public static partial class ResourceStringParser
{
    private static InstrumentResource ParseTcpip(ResourceParts parts, int board, int body, string? resourceClass)
    {
        var host = Host(parts, 1);
        if (resourceClass == "SOCKET")
        {
            if (body > 2)
            {
                throw parts.Error(3, "is unexpected: a SOCKET resource is TCPIP::host::port::SOCKET", "'SOCKET'");
            }

            var port = body < 2 ? TcpSocketResource.DefaultScpiPort : Port(parts, 2);
            return new TcpSocketResource(parts.Text, board, host, port);
        }

        if (body > 2)
        {
            throw parts.Error(3, "is unexpected: an INSTR resource is TCPIP::host[::device]::INSTR", "'INSTR'");
        }

        var device = body == 2 ? parts.At(2).Value : "inst0";
        if (!NamePattern().IsMatch(device))
        {
            throw parts.IsNot(2, "a LAN device name such as inst0 or hislip0");
        }

        return new VxiInstrumentResource(parts.Text, board, host, device);
    }

    private static SerialResource ParseSerial(ResourceParts parts, int? board, int body)
    {
        var settings = SerialOptionParser.Parse(parts);
        if (board is not null)
        {
            if (body > 0)
            {
                throw parts.Error(1, "is unexpected: give either ASRLn::INSTR or ASRL::/dev/path::INSTR", "'INSTR'");
            }

            return board >= 1
                ? new SerialResource(parts.Text, board, $"/dev/ttyS{board - 1}", settings)
                : throw parts.Error(
                    0,
                    "has no device: serial boards count from 1 (ASRL1 is /dev/ttyS0)",
                    "ASRL1 or higher"
                );
        }

        return new SerialResource(parts.Text, null, DevicePath(parts, 1, body), settings);
    }

    private static UsbInstrumentResource ParseUsb(ResourceParts parts, int board, int body)
    {
        if (body is < 3 or > 4)
        {
            throw body < 3
                ? parts.Error(
                    body + 1,
                    $"is where the {s_usbFields[body]} should be: USB[n]::vid::pid::serial[::interface]::INSTR",
                    s_usbFields[body]
                )
                : parts.Error(5, "is unexpected after the interface number", "'INSTR'");
        }

        var vid = UsbId(parts, 1, "a vendor id 0x0000-0xFFFF");
        var pid = UsbId(parts, 2, "a product id 0x0000-0xFFFF");
        var serial = parts.At(3).Value;
        if (serial.Length == 0)
        {
            throw parts.IsNot(3, "a serial number");
        }

        int? intfc =
            body == 4
                ? int.TryParse(parts.At(4).Value, NumberStyles.None, CultureInfo.InvariantCulture, out var n)
                && n <= 255
                    ? n
                    : throw parts.IsNot(4, "a USB interface number 0-255")
                : null;
        return new UsbInstrumentResource(parts.Text, board, vid, pid, serial, intfc);
    }

    private static string Host(ResourceParts parts, int index)
    {
        var host = parts.At(index).Value;
        if (host.StartsWith('[') && host.EndsWith(']') && System.Net.IPAddress.TryParse(host[1..^1], out _))
        {
            return host[1..^1];
        }

        return HostPattern().IsMatch(host) && !IsClass(host)
            ? host
            : throw parts.IsNot(index, "a host name or IP address");
    }

    private static int Port(ResourceParts parts, int index) =>
        int.TryParse(parts.At(index).Value, NumberStyles.None, CultureInfo.InvariantCulture, out var port)
        && port is >= 1 and <= 65535
            ? port
            : throw parts.IsNot(index, "a port number 1-65535");

    private static int UsbId(ResourceParts parts, int index, string expected)
    {
        var text = parts.At(index).Value;
        var hex = text.StartsWith("0x", StringComparison.OrdinalIgnoreCase);
        var ok = hex
            ? int.TryParse(text[2..], NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture, out var v)
            : int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out v);
        return ok && v is >= 0 and <= 0xFFFF ? v : throw parts.IsNot(index, expected);
    }

    private static int NoBoard(ResourceParts parts, int? board, string keyword) =>
        board is null ? 1 : throw parts.Error(0, $"has a board number, which {keyword} does not take", keyword);

    private static string DevicePath(ResourceParts parts, int index, int body)
    {
        if (body > index)
        {
            throw parts.Error(index + 1, "is unexpected after the device path", "'INSTR'");
        }

        var path = parts.At(index).Value;
        return path.StartsWith('/') && path.Length > 1
            ? path
            : throw parts.IsNot(index, "a device path starting with '/'");
    }

    private static string SimulatorName(ResourceParts parts, int index, int body)
    {
        if (body > index)
        {
            throw parts.Error(index + 1, "is unexpected after the simulator name", "'INSTR'");
        }

        return NamePattern().IsMatch(parts.At(index).Value)
            ? parts.At(index).Value
            : throw parts.IsNot(index, "a simulator name of letters, digits, '-', '_' or '.'");
    }
}
