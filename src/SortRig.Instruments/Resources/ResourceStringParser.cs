using System.Globalization;
using System.Text.RegularExpressions;

namespace SortRig.Instruments.Resources;

/// <summary>
/// Parses VISA resource strings (IVI VPP-4.3 address grammar, keywords case-insensitive) and our
/// extensions: ASRL::/dev/path::INSTR, USBTMC::/dev/usbtmcN::INSTR, SIM::name::INSTR,
/// TCPIP::host::SOCKET (port 5025), TYPED::profile::INSTR (values typed by the operator) and "?baud=..&amp;.." serial
/// options. See docs/instruments.md.
/// </summary>
public static partial class ResourceStringParser
{
    private static readonly string[] s_usbFields = ["vendor id", "product id", "serial number"];

    private const string InterfaceKeywords = "TCPIP[n], ASRL[n], USB[n], USBTMC, SIM or TYPED";

    /// <summary>Parses <paramref name="text"/> (surrounding white space ignored).</summary>
    /// <exception cref="ResourceStringException">The string is malformed; names the part and what was
    /// expected.</exception>
    public static InstrumentResource Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var parts = ResourceParts.Split(text.Trim());
        var head = InterfacePattern().Match(parts.At(0).Value);
        if (!head.Success)
        {
            throw parts.IsNot(0, $"an interface keyword {InterfaceKeywords}");
        }

        var keyword = head.Groups[1].Value.ToUpperInvariant();
        int? board = null;
        if (head.Groups[2].Length > 0)
        {
            board =
                int.TryParse(head.Groups[2].Value, NumberStyles.None, CultureInfo.InvariantCulture, out var b)
                && b <= 999
                    ? b
                    : throw parts.IsNot(0, "an interface keyword with a board number 0-999");
        }

        var last = parts.Parts.Count - 1;
        var resourceClass = last >= 1 && IsClass(parts.At(last).Value) ? parts.At(last).Value.ToUpperInvariant() : null;
        var body = resourceClass is null ? last : last - 1;
        if (parts.Options is not null && keyword != "ASRL")
        {
            throw new ResourceStringException(
                parts.Text,
                1,
                parts.Options,
                parts.OptionsOffset,
                "is not allowed: serial options follow ASRL resources only",
                "no '?' options",
                isOption: true
            );
        }

        if (resourceClass == "SOCKET" && keyword != "TCPIP")
        {
            throw parts.Error(last, "is not allowed here: only TCPIP has SOCKET resources", "INSTR");
        }

        return keyword switch
        {
            "TCPIP" => ParseTcpip(parts, board ?? 0, body, resourceClass),
            "ASRL" => ParseSerial(parts, board, body),
            "USB" => ParseUsb(parts, board ?? 0, body),
            "USBTMC" => new UsbTmcResource(parts.Text, DevicePath(parts, NoBoard(parts, board, keyword), body)),
            "TYPED" => new TypedResource(parts.Text, TypedProfileName(parts, NoBoard(parts, board, keyword), body)),
            _ => new SimulatorResource(parts.Text, SimulatorName(parts, NoBoard(parts, board, keyword), body)),
        };
    }

    private static bool IsClass(string part) =>
        part.Equals("INSTR", StringComparison.OrdinalIgnoreCase)
        || part.Equals("SOCKET", StringComparison.OrdinalIgnoreCase);

    [GeneratedRegex(
        "^(TCPIP|ASRL|USBTMC|USB|SIM|TYPED)([0-9]*)$",
        RegexOptions.IgnoreCase | RegexOptions.CultureInvariant
    )]
    private static partial Regex InterfacePattern();

    [GeneratedRegex("^[A-Za-z0-9](?:[A-Za-z0-9._-]*[A-Za-z0-9])?$", RegexOptions.CultureInvariant)]
    private static partial Regex HostPattern();

    [GeneratedRegex("^[A-Za-z0-9._-]+$", RegexOptions.CultureInvariant)]
    private static partial Regex NamePattern();
}
