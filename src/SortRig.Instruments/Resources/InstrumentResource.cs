namespace SortRig.Instruments.Resources;

/// <summary>How a resource reaches its instrument.</summary>
public enum TransportKind
{
    /// <summary>Raw SCPI over TCP (TCPIP::host::port::SOCKET).</summary>
    TcpSocket = 0,

    /// <summary>Serial port (ASRL).</summary>
    Serial = 1,

    /// <summary>Linux usbtmc character device (our USBTMC::/dev/usbtmcN::INSTR form).</summary>
    UsbTmc = 2,

    /// <summary>The embedded simulated meter (our SIM::name::INSTR form).</summary>
    Simulator = 3,

    /// <summary>TCPIP::host::INSTR: needs VXI-11 or HiSLIP, which SortRig does not speak.</summary>
    Vxi11 = 4,

    /// <summary>VISA USB::vid::pid::serial::INSTR: parsed, but open it as USBTMC::/dev/usbtmcN::INSTR.</summary>
    UsbInstr = 5,

    /// <summary>No link: the operator types the display of a hand-held meter (our TYPED::profile::INSTR
    /// form).</summary>
    Typed = 6,
}

/// <summary>A parsed instrument address; <see cref="Text"/> is the string as the user gave it.</summary>
public abstract record InstrumentResource(string Text)
{
    /// <summary>How this resource reaches its instrument.</summary>
    public abstract TransportKind Transport { get; }
}

/// <summary>TCPIP[board]::host::port::SOCKET — raw SCPI socket.</summary>
public sealed record TcpSocketResource(string Text, int Board, string Host, int Port) : InstrumentResource(Text)
{
    /// <summary>The conventional raw SCPI port, used when TCPIP::host::SOCKET gives none (our extension).</summary>
    public const int DefaultScpiPort = 5025;

    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.TcpSocket;
}

/// <summary>TCPIP[board]::host[::lan device name]::INSTR — parsed, not supported (needs VXI-11).</summary>
public sealed record VxiInstrumentResource(string Text, int Board, string Host, string DeviceName)
    : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.Vxi11;
}

/// <summary>ASRL[board]::INSTR or ASRL::/dev/path::INSTR, with optional serial settings.</summary>
/// <param name="Text">The resource string.</param>
/// <param name="Board">The VISA board number, or null when a device path was given.</param>
/// <param name="DevicePath">Device file: the path given, or /dev/ttyS(board-1) for ASRLn.</param>
/// <param name="Settings">Serial settings given in the string; the rest come from the profile or defaults.</param>
public sealed record SerialResource(string Text, int? Board, string DevicePath, SerialOverrides Settings)
    : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.Serial;
}

/// <summary>USB[board]::vid::pid::serial[::interface]::INSTR — parsed; open it through
/// USBTMC::/dev/usbtmcN::INSTR.</summary>
public sealed record UsbInstrumentResource(
    string Text,
    int Board,
    int VendorId,
    int ProductId,
    string SerialNumber,
    int? Interface
) : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.UsbInstr;
}

/// <summary>USBTMC::/dev/usbtmcN::INSTR — our form for the Linux usbtmc character device.</summary>
public sealed record UsbTmcResource(string Text, string DevicePath) : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.UsbTmc;
}

/// <summary>SIM::name::INSTR — the embedded simulated meter called <paramref name="Name"/>.</summary>
public sealed record SimulatorResource(string Text, string Name) : InstrumentResource(Text)
{
    /// <inheritdoc/>
    public override TransportKind Transport => TransportKind.Simulator;
}
