using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using Microsoft.Extensions.Logging;

namespace SortRig.Simulator.Serving;

/// <summary>
/// SCPI over a raw TCP socket on 127.0.0.1 (as on port 5025 of a LAN meter). Clients may come and
/// go one after another or overlap; their messages run one at a time on the one device.
/// </summary>
internal sealed class TcpScpiServer : IAsyncDisposable
{
    private readonly TcpListener _listener;
    private readonly ScpiDevice _device;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly CancellationTokenSource _stop;
    private readonly ConcurrentDictionary<int, Task> _clients = new();
    private readonly Task _accepting;
    private int _nextClient;

    private TcpScpiServer(ScpiDevice device, int port, TimeProvider time, ILogger logger, CancellationToken lifetime)
    {
        (_device, _time, _logger) = (device, time, logger);
        _stop = CancellationTokenSource.CreateLinkedTokenSource(lifetime);
        _listener = new TcpListener(IPAddress.Loopback, port);
        _listener.Start();
        Endpoint = (IPEndPoint)_listener.LocalEndpoint;
        _logger.TcpListening(Endpoint.ToString());
        _accepting = AcceptAsync(_stop.Token);
    }

    /// <summary>The bound address and port (the real port when 0 was asked for).</summary>
    public IPEndPoint Endpoint { get; }

    public static TcpScpiServer Start(
        ScpiDevice device,
        int port,
        TimeProvider time,
        ILogger logger,
        CancellationToken lifetime
    ) => new(device, port, time, logger, lifetime);

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync().ConfigureAwait(false);
        _listener.Stop();
        await _accepting.ConfigureAwait(false);
        await Task.WhenAll(_clients.Values).ConfigureAwait(false);
        _stop.Dispose();
    }

    private async Task AcceptAsync(CancellationToken ct)
    {
        while (!ct.IsCancellationRequested)
        {
            TcpClient client;
            try
            {
                client = await _listener.AcceptTcpClientAsync(ct).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is OperationCanceledException or SocketException or ObjectDisposedException)
            {
                return;
            }

            var id = Interlocked.Increment(ref _nextClient);
            _clients[id] = ServeAsync(client, id, ct);
        }
    }

    private async Task ServeAsync(TcpClient client, int id, CancellationToken ct)
    {
        await Task.Yield();
        var name = $"tcp#{id} {client.Client.RemoteEndPoint}";
        _logger.ClientConnected(name);
        try
        {
            client.NoDelay = true;
            var loop = new ConnectionLoop(_device, client.GetStream(), name, serial: false, _time, _logger);
            await loop.RunAsync(ct).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is IOException or SocketException or ObjectDisposedException)
        {
            _logger.ConnectionFailed(ex, name);
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // Server stopping.
        }
#pragma warning disable CA1031 // one broken connection must not take the server down; it is logged
        catch (Exception ex)
        {
            _logger.ConnectionFailed(ex, name);
        }
#pragma warning restore CA1031
        finally
        {
            client.Dispose();
            _logger.ClientDisconnected(name);
            _clients.TryRemove(id, out _);
        }
    }
}
