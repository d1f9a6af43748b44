using System.Net.Sockets;

namespace SortRig.Instruments.Transports;

/// <summary>A raw SCPI socket: SCPI lines over a plain TCP connection (conventionally port 5025).</summary>
internal sealed class TcpMessageLink : StreamMessageLink
{
    private readonly TcpClient _client;

    private TcpMessageLink(string endpoint, TcpClient client, MessageLinkOptions options, TimeProvider time)
        : base(endpoint, client.GetStream(), options, time)
    {
        _client = client;
    }

    /// <summary>Connects within the connect timeout, with Nagle off and TCP keep-alive on.</summary>
    public static async Task<IMessageLink> OpenAsync(
        string host,
        int port,
        MessageLinkOptions options,
        TimeProvider time,
        CancellationToken ct
    )
    {
        var endpoint = $"tcp://{host}:{port}";
        var client = new TcpClient { NoDelay = true };
        using var timeoutCts = new CancellationTokenSource(options.ConnectTimeout, time);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(ct, timeoutCts.Token);
        try
        {
            await client.ConnectAsync(host, port, linked.Token).ConfigureAwait(false);
            client.Client.SetSocketOption(SocketOptionLevel.Socket, SocketOptionName.KeepAlive, true);
            return new TcpMessageLink(endpoint, client, options, time);
        }
        catch (OperationCanceledException ex) when (!ct.IsCancellationRequested)
        {
            client.Dispose();
            throw new InstrumentLinkException(
                endpoint,
                $"no connection within {options.ConnectTimeout.TotalMilliseconds:0} ms",
                ex,
                openFailed: true
            );
        }
        catch (SocketException ex)
        {
            client.Dispose();
            throw new InstrumentLinkException(endpoint, $"could not connect: {ex.Message}", ex, openFailed: true);
        }
        catch
        {
            client.Dispose();
            throw;
        }
    }

    protected override ValueTask ReleaseOwnedAsync()
    {
        _client.Dispose();
        return ValueTask.CompletedTask;
    }
}
