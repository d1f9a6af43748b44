using System.Collections.Concurrent;
using System.Net;
using System.Net.Sockets;
using System.Text;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Support;

/// <summary>What the scripted peer does with one received line.</summary>
internal abstract record PeerAction
{
    /// <summary>Send nothing (a command, or a query the device ignores).</summary>
    public static PeerAction Silent { get; } = new SilentAction();

    /// <summary>Close the connection without answering.</summary>
    public static PeerAction Drop { get; } = new DropAction();

    /// <summary>Answer with <paramref name="text"/> and "\n", after <paramref name="delayMs"/>.</summary>
    public static PeerAction Reply(string text, int delayMs = 0) => new ReplyAction(text + "\n", delayMs);

    /// <summary>Send these exact characters (for garbage, partial lines, other terminators).</summary>
    public static PeerAction Raw(string text) => new ReplyAction(text, 0);

    internal sealed record SilentAction : PeerAction;

    internal sealed record DropAction : PeerAction;

    internal sealed record ReplyAction(string Text, int DelayMs) : PeerAction;
}

/// <summary>
/// A small SCPI device on a real loopback TCP socket: answers per script, can go silent, garble
/// or drop the connection, records what it received, and counts commands that arrived while a
/// reply was still owed (interleaving).
/// </summary>
internal sealed class ScriptedScpiPeer : IAsyncDisposable
{
    private readonly TcpListener _listener = new(IPAddress.Loopback, 0);
    private readonly Func<string, PeerAction> _script;
    private readonly ConcurrentQueue<string> _received = new();
    private readonly CancellationTokenSource _stop = new();
    private readonly Task _serving;
    private int _overlaps;

    private ScriptedScpiPeer(Func<string, PeerAction> script)
    {
        _script = script;
        _listener.Start();
        _serving = Task.Run(ServeAsync);
    }

    public int Port => ((IPEndPoint)_listener.LocalEndpoint).Port;

    public string Resource => $"TCPIP::127.0.0.1::{Port}::SOCKET";

    public IReadOnlyList<string> Received => [.. _received];

    /// <summary>Queries that had another command arrive before their reply was sent.</summary>
    public int Overlaps => Volatile.Read(ref _overlaps);

    public static ScriptedScpiPeer Start(Func<string, PeerAction> script) => new(script);

    public async Task<IMessageLink> ConnectLinkAsync(MessageLinkOptions? options = null) =>
        await new MessageLinkFactory().OpenAsync(
            ResourceStringParser.Parse(Resource),
            options ?? MessageLinkOptions.Default,
            null,
            CancellationToken.None
        );

    public async Task<ScpiSession> ConnectSessionAsync(ScpiSessionOptions? options = null, TimeProvider? time = null) =>
        new(await ConnectLinkAsync(), options ?? new ScpiSessionOptions(TimeSpan.FromSeconds(2)), time);

    public async ValueTask DisposeAsync()
    {
        await _stop.CancelAsync();
        _listener.Stop();
        try
        {
            await _serving;
        }
        catch (Exception ex) when (ex is OperationCanceledException or SocketException or ObjectDisposedException) { }

        _stop.Dispose();
    }

    private async Task ServeAsync()
    {
        while (!_stop.IsCancellationRequested)
        {
            using var client = await _listener.AcceptTcpClientAsync(_stop.Token);
            try
            {
                await ServeClientAsync(client);
            }
            catch (Exception ex) when (ex is IOException or SocketException)
            {
                // The client went away; wait for the next one.
            }
        }
    }

    private async Task ServeClientAsync(TcpClient client)
    {
        var stream = client.GetStream();
        var pending = new StringBuilder();
        var buffer = new byte[4096];
        while (true)
        {
            var n = await stream.ReadAsync(buffer, _stop.Token);
            if (n == 0)
            {
                return;
            }

            pending.Append(Encoding.Latin1.GetString(buffer, 0, n));
            int at;
            while ((at = pending.ToString().IndexOf('\n', StringComparison.Ordinal)) >= 0)
            {
                var line = pending.ToString(0, at).TrimEnd('\r');
                pending.Remove(0, at + 1);
                _received.Enqueue(line);
                switch (_script(line))
                {
                    case PeerAction.DropAction:
                        client.Client.Close();
                        return;
                    case PeerAction.ReplyAction reply:
                        if (reply.DelayMs > 0)
                        {
                            await Task.Delay(reply.DelayMs, _stop.Token);
                        }

                        if (pending.Length > 0 || client.Available > 0)
                        {
                            Interlocked.Increment(ref _overlaps);
                        }

                        await stream.WriteAsync(Encoding.Latin1.GetBytes(reply.Text), _stop.Token);
                        break;
                }
            }
        }
    }
}
