using System.IO.Ports;

namespace SortRig.Instruments.Transports;

/// <summary>
/// SCPI lines over a serial port. SerialPort's own timeouts and events are not used: reads go
/// through BaseStream with our timeout (linked cancellation) like every other link.
/// </summary>
internal sealed class SerialMessageLink : StreamMessageLink
{
    private readonly SerialPort _port;

    private SerialMessageLink(string endpoint, SerialPort port, MessageLinkOptions options, TimeProvider time)
        : base(endpoint, port.BaseStream, options, time)
    {
        _port = port;
    }

    /// <summary>Opens the port (e.g. /dev/ttyUSB0) with the given line settings.</summary>
    public static IMessageLink Open(
        string portName,
        SerialSettings settings,
        MessageLinkOptions options,
        TimeProvider time
    )
    {
        var endpoint = $"serial://{portName} ({settings})";
        if (!OperatingSystem.IsWindows() && !File.Exists(portName))
        {
            // SerialPort reports a missing device as "access denied"; say what is wrong.
            throw new InstrumentLinkException(
                endpoint,
                $"no such device '{portName}'; check the cable and the device name (ls /dev/ttyUSB* /dev/ttyACM*)",
                null,
                openFailed: true
            );
        }

        var port = new SerialPort(portName, settings.BaudRate, settings.Parity, settings.DataBits, settings.StopBits)
        {
            Handshake = settings.Handshake,
            ReadTimeout = SerialPort.InfiniteTimeout,
            WriteTimeout = SerialPort.InfiniteTimeout,
        };
        try
        {
            port.Open();
            port.DiscardInBuffer();
            return new SerialMessageLink(endpoint, port, options, time);
        }
        catch (Exception ex)
            when (ex is IOException or UnauthorizedAccessException or ArgumentException or InvalidOperationException)
        {
            port.Dispose();
            throw new InstrumentLinkException(
                endpoint,
                $"could not open the serial port: {ex.Message}",
                ex,
                openFailed: true
            );
        }
    }

    protected override ValueTask ReleaseOwnedAsync()
    {
        _port.Dispose();
        return ValueTask.CompletedTask;
    }
}
