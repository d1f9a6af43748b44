using FsCheck;
using FsCheck.Fluent;
using SortRig.Instruments.Resources;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>A resource string and the record it must parse to.</summary>
internal sealed record ValidResource(string Text, InstrumentResource Expected)
{
    /// <inheritdoc/>
    public override string ToString() => $"'{TextEdit.Escaped(Text)}'";
}

/// <summary>
/// Valid resource strings of every form the parser knows (IVI VPP-4.3 TCPIP, ASRL, USB, from memory;
/// our USBTMC and SIM forms and serial options, docs/instruments.md), keywords in random case.
/// </summary>
internal static class ResourceStringGenerators
{
    /// <summary>The punctuation of resource strings, weighted into inserted text.</summary>
    public const string Syntax = ":::?&=[]/._-0123456789xXINSTRSOCKETtcpipasrlusbsim";

    private static readonly Gen<string> s_pad = Gen.Elements(
        string.Empty,
        string.Empty,
        string.Empty,
        " ",
        "\t",
        "\r\n"
    );

    public static Gen<ValidResource> Valid =>
        Gen.OneOf(TcpSocket, Vxi, SerialBoard, SerialPath, Usb, UsbTmc, Simulator)
            .SelectMany(r => s_pad.Select(pad => r with { Text = pad + r.Text + pad }));

    private static Gen<ValidResource> TcpSocket =>
        from board in Board
        from host in Host
        from port in Gen.Frequency((4, Gen.Choose(1, 65535).Select(p => (int?)p)), (1, Gen.Constant((int?)null)))
        from kw in Cased("TCPIP")
        from cls in Cased("SOCKET")
        let text = $"{kw}{board.Text}::{host.Text}{(port is null ? string.Empty : $"::{port}")}::{cls}"
        select new ValidResource(
            text,
            new TcpSocketResource(text, board.Value ?? 0, host.Value, port ?? TcpSocketResource.DefaultScpiPort)
        );

    private static Gen<ValidResource> Vxi =>
        from board in Board
        from host in Host
        from device in Gen.Frequency((1, Gen.Constant((string?)null)), (2, Name.Select(n => (string?)n)))
        from kw in Cased("TCPIP")
        from cls in Cased("INSTR")
        let text = $"{kw}{board.Text}::{host.Text}{(device is null ? string.Empty : "::" + device)}::{cls}"
        select new ValidResource(
            text,
            new VxiInstrumentResource(text, board.Value ?? 0, host.Value, device ?? "inst0")
        );

    private static Gen<ValidResource> SerialBoard =>
        from board in Gen.Choose(1, 999)
        from kw in Cased("ASRL")
        from cls in Cased("INSTR")
        from options in SerialOptions
        let text = $"{kw}{board}::{cls}{options.Text}"
        select new ValidResource(text, new SerialResource(text, board, $"/dev/ttyS{board - 1}", options.Value));

    private static Gen<ValidResource> SerialPath =>
        from path in DevicePath("tty")
        from kw in Cased("ASRL")
        from cls in ClassOrNone
        from options in SerialOptions
        let text = $"{kw}::{path}{cls}{options.Text}"
        select new ValidResource(text, new SerialResource(text, null, path, options.Value));

    private static Gen<ValidResource> Usb =>
        from board in Board
        from vid in UsbId
        from pid in UsbId
        from serial in Name.Where(s =>
            !s.Equals("INSTR", StringComparison.OrdinalIgnoreCase)
            && !s.Equals("SOCKET", StringComparison.OrdinalIgnoreCase)
        )
        from intf in Gen.Frequency((1, Gen.Choose(0, 255).Select(i => (int?)i)), (2, Gen.Constant((int?)null)))
        from kw in Cased("USB")
        from cls in Cased("INSTR")
        let text = $"{kw}{board.Text}::{vid.Text}::{pid.Text}::{serial}"
            + $"{(intf is null ? string.Empty : $"::{intf}")}::{cls}"
        select new ValidResource(
            text,
            new UsbInstrumentResource(text, board.Value ?? 0, vid.Value, pid.Value, serial, intf)
        );

    private static Gen<ValidResource> UsbTmc =>
        from path in DevicePath("usbtmc")
        from kw in Cased("USBTMC")
        from cls in ClassOrNone
        let text = $"{kw}::{path}{cls}"
        select new ValidResource(text, new UsbTmcResource(text, path));

    private static Gen<ValidResource> Simulator =>
        from name in Name
        from kw in Cased("SIM")
        from cls in ClassOrNone
        let text = $"{kw}::{name}{cls}"
        select new ValidResource(text, new SimulatorResource(text, name));

    private static Gen<(string Text, int? Value)> Board =>
        Gen.Frequency(
            (2, Gen.Constant((string.Empty, (int?)null))),
            (1, Gen.Choose(0, 999).Select(b => (b.ToString(Inv), (int?)b)))
        );

    private static Gen<(string Text, string Value)> Host =>
        Gen.Frequency(
            (
                3,
                Name.Where(n =>
                        char.IsAsciiLetterOrDigit(n[0])
                        && char.IsAsciiLetterOrDigit(n[^1])
                        && !n.Equals("INSTR", StringComparison.OrdinalIgnoreCase)
                        && !n.Equals("SOCKET", StringComparison.OrdinalIgnoreCase)
                    )
                    .Select(n => (n, n))
            ),
            (2, Gen.ArrayOf(Gen.Choose(0, 255), 4).Select(a => string.Join('.', a)).Select(ip => (ip, ip))),
            (1, Gen.Elements("::1", "fe80::1", "2001:db8::5025", "::ffff:192.0.2.1").Select(ip => ($"[{ip}]", ip)))
        );

    private static Gen<(string Text, int Value)> UsbId =>
        from id in Gen.Choose(0, 0xFFFF)
        from form in Gen.Elements("0x{0:X4}", "0X{0:x}", "{0}")
        select (string.Format(Inv, form, id), id);

    private static Gen<string> Name =>
        Gen.Choose(1, 12)
            .SelectMany(n =>
                Gen.ArrayOf(
                    Gen.Elements("abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789._-".ToCharArray()),
                    n
                )
            )
            .Select(a => new string(a));

    private static Gen<string> DevicePath(string stem) =>
        from dir in Gen.Elements("/dev/", "/dev/serial/by-id/", "/tmp/")
        from name in Name
        select dir + stem + name;

    private static Gen<string> ClassOrNone =>
        Gen.Frequency((3, Cased("INSTR").Select(c => "::" + c)), (1, Gen.Constant(string.Empty)));

    private static Gen<string> Cased(string word) =>
        Gen.ArrayOf(Gen.Elements(false, true, true), word.Length)
            .Select(lower => string.Concat(word.Select((c, i) => lower[i] ? char.ToLowerInvariant(c) : c)));

    private static Gen<(string Text, SerialOverrides Value)> SerialOptions =>
        from picked in Gen.SubListOf(SerialOptionGenerators.All)
        from order in Gen.Shuffle(picked.ToArray())
        from chosen in Gen.CollectToArray<SerialOptionText>(order)
        select (
            chosen.Length == 0 ? string.Empty : "?" + string.Join('&', chosen.Select(o => o.Text)),
            chosen.Aggregate(SerialOverrides.None, (s, o) => o.Apply(s))
        );

    private static IFormatProvider Inv => System.Globalization.CultureInfo.InvariantCulture;
}
