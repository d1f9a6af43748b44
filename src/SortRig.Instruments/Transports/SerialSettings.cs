using System.IO.Ports;

namespace SortRig.Instruments.Transports;

/// <summary>Serial line settings. Validated at construction.</summary>
public sealed record SerialSettings
{
    /// <summary>9600 baud, 8 data bits, no parity, 1 stop bit, no handshake.</summary>
    public static SerialSettings Default { get; } = new();

    /// <summary>Creates validated settings.</summary>
    /// <param name="baudRate">Bits per second, 50-4 000 000; default 9600.</param>
    /// <param name="parity">Parity; default none.</param>
    /// <param name="dataBits">Data bits, 5-8; default 8.</param>
    /// <param name="stopBits">Stop bits, One, OnePointFive or Two; default One.</param>
    /// <param name="handshake">Flow control: None, RequestToSend, XOnXOff or RequestToSendXOnXOff; default
    /// None.</param>
    /// <exception cref="ArgumentOutOfRangeException">A value is outside its valid range.</exception>
    public SerialSettings(
        int baudRate = 9600,
        Parity parity = Parity.None,
        int dataBits = 8,
        StopBits stopBits = StopBits.One,
        Handshake handshake = Handshake.None
    )
    {
        BaudRate = baudRate is >= 50 and <= 4_000_000
            ? baudRate
            : throw new ArgumentOutOfRangeException(nameof(baudRate), baudRate, "baudRate must be 50 to 4 000 000");
        Parity = Enum.IsDefined(parity)
            ? parity
            : throw new ArgumentOutOfRangeException(nameof(parity), parity, "unknown parity");
        DataBits = dataBits is >= 5 and <= 8
            ? dataBits
            : throw new ArgumentOutOfRangeException(nameof(dataBits), dataBits, "dataBits must be 5 to 8");
        StopBits = stopBits is StopBits.One or StopBits.OnePointFive or StopBits.Two
            ? stopBits
            : throw new ArgumentOutOfRangeException(
                nameof(stopBits),
                stopBits,
                "stopBits must be One, OnePointFive or Two"
            );
        Handshake = Enum.IsDefined(handshake)
            ? handshake
            : throw new ArgumentOutOfRangeException(nameof(handshake), handshake, "unknown handshake");
    }

    /// <summary>Bits per second.</summary>
    public int BaudRate { get; }

    /// <summary>Parity bit.</summary>
    public Parity Parity { get; }

    /// <summary>Data bits per character, 5-8.</summary>
    public int DataBits { get; }

    /// <summary>Stop bits.</summary>
    public StopBits StopBits { get; }

    /// <summary>Flow control.</summary>
    public Handshake Handshake { get; }

    /// <inheritdoc/>
    public override string ToString() => $"{BaudRate} {DataBits}{Parity.ToString()[0]}{StopBitsText} {Handshake}";

    private string StopBitsText =>
        StopBits switch
        {
            StopBits.OnePointFive => "1.5",
            StopBits.Two => "2",
            _ => "1",
        };
}
