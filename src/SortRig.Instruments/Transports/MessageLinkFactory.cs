using SortRig.Instruments.Resources;

namespace SortRig.Instruments.Transports;

/// <summary>
/// Opens a message link for a parsed resource. SIM resources are handed to a resolver that the
/// host registers (it starts the simulated meter and returns its real TCP or serial resource).
/// </summary>
public sealed class MessageLinkFactory
{
    private readonly TimeProvider _time;
    private readonly Func<SimulatorResource, CancellationToken, ValueTask<InstrumentResource>>? _simulatorResolver;

    /// <summary>Creates the factory.</summary>
    /// <param name="time">Clock for timeouts; default <see cref="TimeProvider.System"/>.</param>
    /// <param name="simulatorResolver">Turns SIM::name::INSTR into the simulator's real resource; null when no
    /// simulator is hosted.</param>
    public MessageLinkFactory(
        TimeProvider? time = null,
        Func<SimulatorResource, CancellationToken, ValueTask<InstrumentResource>>? simulatorResolver = null
    )
    {
        _time = time ?? TimeProvider.System;
        _simulatorResolver = simulatorResolver;
    }

    /// <summary>Wraps an already open byte stream (e.g. an in-process pipe) as a link that owns it.</summary>
    public static IMessageLink FromStream(
        string endpoint,
        Stream stream,
        MessageLinkOptions options,
        TimeProvider? time = null
    ) => new StreamMessageLink(endpoint, stream, options, time ?? TimeProvider.System);

    /// <summary>Opens a link for <paramref name="resource"/>.</summary>
    /// <param name="resource">Parsed resource (see <see cref="ResourceStringParser"/>).</param>
    /// <param name="options">Terminator and timeouts.</param>
    /// <param name="serialDefaults">Serial settings for fields the resource does not give; default 9600 8N1, no
    /// handshake.</param>
    /// <param name="ct">Caller cancellation.</param>
    /// <exception cref="InstrumentLinkException">The link could not be opened, or the resource kind is not
    /// supported.</exception>
    public async ValueTask<IMessageLink> OpenAsync(
        InstrumentResource resource,
        MessageLinkOptions options,
        SerialSettings? serialDefaults,
        CancellationToken ct
    )
    {
        ArgumentNullException.ThrowIfNull(resource);
        switch (resource)
        {
            case TcpSocketResource tcp:
                return await TcpMessageLink.OpenAsync(tcp.Host, tcp.Port, options, _time, ct).ConfigureAwait(false);
            case SerialResource serial:
                return SerialMessageLink.Open(
                    serial.DevicePath,
                    serial.Settings.ApplyTo(serialDefaults ?? SerialSettings.Default),
                    options,
                    _time
                );
            case UsbTmcResource usb:
                return UsbTmcMessageLink.Open(usb.DevicePath, options, _time);
            case SimulatorResource sim when _simulatorResolver is not null:
                var real = await _simulatorResolver(sim, ct).ConfigureAwait(false);
                return real is SimulatorResource
                    ? throw new InstrumentLinkException(
                        resource.Text,
                        "the simulator resolver returned another SIM resource"
                    )
                    : await OpenAsync(real, options, serialDefaults, ct).ConfigureAwait(false);
            case SimulatorResource:
                throw new InstrumentLinkException(resource.Text, "no simulated meter is hosted in this process");
            case VxiInstrumentResource:
                throw new InstrumentLinkException(
                    resource.Text,
                    "TCPIP::host::INSTR needs VXI-11 or HiSLIP, which SortRig does not speak; use the raw socket "
                        + "TCPIP::host::5025::SOCKET"
                );
            case UsbInstrumentResource:
                throw new InstrumentLinkException(
                    resource.Text,
                    "VISA USB::vid::pid::serial addresses are not looked up; open the usbtmc device as "
                        + "USBTMC::/dev/usbtmc0::INSTR"
                );
            default:
                throw new InstrumentLinkException(resource.Text, $"unsupported resource kind {resource.Transport}");
        }
    }
}
