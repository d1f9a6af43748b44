using System.Net;
using System.Net.Sockets;

namespace SortRig.Host.Tests.Lab.Support;

/// <summary>
/// A TCP proxy on 127.0.0.1 in front of a server that can stop forwarding on command: the sockets stay open, bytes
/// simply stop moving (a hung switch, a half-dead VPN), which no connection error reveals; only a timeout does.
/// New connections made while stalled are accepted and then hang too.
/// </summary>
internal sealed class StallingProxy : IAsyncDisposable
{
    private readonly TcpListener _listener = new(IPAddress.Loopback, 0);
    private readonly int _targetPort;
    private readonly CancellationTokenSource _stop = new();
    private readonly List<TcpClient> _clients = [];
    private readonly Task _accepting;
    private volatile TaskCompletionSource _open = Opened();

    public StallingProxy(int targetPort)
    {
        _targetPort = targetPort;
        _listener.Start();
        _accepting = AcceptAsync();
    }

    public int Port => ((IPEndPoint)_listener.LocalEndpoint).Port;

    /// <summary>Stops forwarding in both directions.</summary>
    public void Stall() => _open = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);

    /// <summary>Forwards again (held bytes go on; connections the client gave up on are closed by it).</summary>
    public void Resume() => _open.TrySetResult();

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync();
        Resume();
        _listener.Stop();
        lock (_clients)
        {
            _clients.ForEach(c => c.Dispose());
        }

        try
        {
            await _accepting;
        }
        catch (OperationCanceledException)
        {
            // Stopped.
        }
        catch (SocketException)
        {
            // Listener closed.
        }

        _stop.Dispose();
    }

    private static TaskCompletionSource Opened()
    {
        var open = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        open.SetResult();
        return open;
    }

    private async Task AcceptAsync()
    {
        while (!_stop.IsCancellationRequested)
        {
            var client = await _listener.AcceptTcpClientAsync(_stop.Token);
            _ = ServeAsync(client);
        }
    }

    private async Task ServeAsync(TcpClient client)
    {
        using var upstream = new TcpClient();
        lock (_clients)
        {
            _clients.Add(client);
            _clients.Add(upstream);
        }

        try
        {
            await _open.Task.WaitAsync(_stop.Token);
            await upstream.ConnectAsync(IPAddress.Loopback, _targetPort, _stop.Token);
            await Task.WhenAny(
                PumpAsync(client.GetStream(), upstream.GetStream()),
                PumpAsync(upstream.GetStream(), client.GetStream())
            );
        }
        catch (Exception e)
            when (e is IOException or SocketException or OperationCanceledException or ObjectDisposedException)
        {
            // A side closed or the proxy stopped.
        }
        finally
        {
            client.Dispose();
        }
    }

    private async Task PumpAsync(NetworkStream from, NetworkStream to)
    {
        var buffer = new byte[16 * 1024];
        try
        {
            while (true)
            {
                int n = await from.ReadAsync(buffer, _stop.Token);
                if (n == 0)
                {
                    return;
                }

                await _open.Task.WaitAsync(_stop.Token); // stalled: hold the bytes
                await to.WriteAsync(buffer.AsMemory(0, n), _stop.Token);
            }
        }
        catch (Exception e)
            when (e is IOException or SocketException or OperationCanceledException or ObjectDisposedException)
        {
            // A side closed or the proxy stopped.
        }
    }
}
