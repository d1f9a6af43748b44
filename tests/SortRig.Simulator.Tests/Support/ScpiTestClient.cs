using System.Net;
using System.Net.Sockets;
using System.Text;

namespace SortRig.Simulator.Tests.Support;

/// <summary>A plain SCPI-over-TCP client for tests: one line out, one line back, with a real-time guard.</summary>
internal sealed class ScpiTestClient : IAsyncDisposable
{
    public static readonly TimeSpan Guard = TimeSpan.FromSeconds(10);

    private readonly TcpClient _client;
    private readonly NetworkStream _stream;
    private readonly StreamReader _reader;

    private ScpiTestClient(TcpClient client)
    {
        _client = client;
        _stream = client.GetStream();
        _reader = new StreamReader(_stream, Encoding.ASCII);
    }

    public static async Task<ScpiTestClient> ConnectAsync(IPEndPoint endpoint)
    {
        var client = new TcpClient { NoDelay = true };
        await client.ConnectAsync(endpoint);
        return new ScpiTestClient(client);
    }

    public async Task SendAsync(string message) => await SendRawAsync(message + "\n");

    public async Task SendRawAsync(string text)
    {
        await _stream.WriteAsync(Encoding.ASCII.GetBytes(text));
        await _stream.FlushAsync();
    }

    /// <summary>The next reply line, or null when the device closed the connection.</summary>
    public async Task<string?> ReadLineAsync(TimeSpan? timeout = null) =>
        await _reader.ReadLineAsync().WaitAsync(timeout ?? Guard);

    public async Task<string> QueryAsync(string query)
    {
        await SendAsync(query);
        return await ReadLineAsync() ?? throw new IOException($"Connection closed instead of a reply to {query}.");
    }

    public async Task<double> QueryNumberAsync(string query) => Numbers.Parse(await QueryAsync(query));

    public async Task<double[]> QueryNumbersAsync(string query) => Numbers.ParseList(await QueryAsync(query));

    /// <summary>Starts a read that should not complete yet; the caller checks it later.</summary>
    public Task<string?> BeginReadLine() => _reader.ReadLineAsync();

    public void Close() => _client.Close();

    public ValueTask DisposeAsync()
    {
        _reader.Dispose();
        _client.Dispose();
        return ValueTask.CompletedTask;
    }
}
