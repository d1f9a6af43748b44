using System.IO.Ports;
using Microsoft.Extensions.Logging;

namespace SortRig.Simulator.Serving;

/// <summary>
/// SCPI over a serial line (8N1, no handshake) on a device path such as /dev/ttyUSB0 or one end of a
/// socat pseudo-terminal pair. A drop fault makes the line go silent for a while instead of closing.
/// </summary>
internal sealed class SerialScpiServer : IAsyncDisposable
{
    private readonly SerialPort _port;
    private readonly CancellationTokenSource _stop;
    private readonly Task _serving;
    private readonly ILogger _logger;

    private SerialScpiServer(
        ScpiDevice device,
        string path,
        int baud,
        TimeProvider time,
        ILogger logger,
        CancellationToken lifetime
    )
    {
        _logger = logger;
        _port = new SerialPort(path, baud, Parity.None, 8, StopBits.One) { Handshake = Handshake.None };
        _port.Open();
        _stop = CancellationTokenSource.CreateLinkedTokenSource(lifetime);
        Path = path;
        _logger.SerialListening(path, baud);
        var loop = new ConnectionLoop(device, _port.BaseStream, $"serial {path}", serial: true, time, logger);
        _serving = ServeAsync(loop, _stop.Token);
    }

    public string Path { get; }

    public static SerialScpiServer Start(
        ScpiDevice device,
        string path,
        int baud,
        TimeProvider time,
        ILogger logger,
        CancellationToken lifetime
    ) => new(device, path, baud, time, logger, lifetime);

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync().ConfigureAwait(false);
        await _serving.ConfigureAwait(false);
        _port.Close();
        _port.Dispose();
        _stop.Dispose();
    }

    private async Task ServeAsync(ConnectionLoop loop, CancellationToken ct)
    {
        try
        {
            await loop.RunAsync(ct).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // Stopping.
        }
        catch (Exception ex) when (ex is IOException or InvalidOperationException or UnauthorizedAccessException)
        {
            _logger.ConnectionFailed(ex, Path);
        }
    }
}
