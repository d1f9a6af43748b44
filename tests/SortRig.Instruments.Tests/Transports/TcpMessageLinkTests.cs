using System.Net;
using System.Net.Sockets;
using System.Text;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Transports;

/// <summary>The link contract over a real loopback TCP connection (raw SCPI socket).</summary>
public sealed class TcpMessageLinkTests : MessageLinkContractTests
{
    protected override async Task<LinkUnderTest> CreateLinkAsync(MessageLinkOptions options)
    {
        var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        var accept = listener.AcceptTcpClientAsync();
        var resource = ResourceStringParser.Parse($"TCPIP::127.0.0.1::{port}::SOCKET");
        var link = await new MessageLinkFactory().OpenAsync(resource, options, null, CancellationToken.None);
        var peer = await accept;
        listener.Stop();
        return new LinkUnderTest(link, new TcpPeer(peer));
    }

    [Fact]
    public async Task Open_NothingListening_ThrowsLinkException()
    {
        var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        var port = ((IPEndPoint)listener.LocalEndpoint).Port;
        listener.Stop();
        var resource = ResourceStringParser.Parse($"TCPIP::127.0.0.1::{port}::SOCKET");
        var ex = await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            new MessageLinkFactory()
                .OpenAsync(resource, MessageLinkOptions.Default, null, CancellationToken.None)
                .AsTask()
        );
        Assert.Contains($"127.0.0.1:{port}", ex.Message, StringComparison.Ordinal);
    }

    private sealed class TcpPeer(TcpClient client) : ILinkPeer
    {
        public Task SendAsync(string text) => client.GetStream().WriteAsync(Encoding.Latin1.GetBytes(text)).AsTask();

        public Task<string> ReceiveAsync(int length) => ReceiveExactlyAsync(client.GetStream(), length);

        public Task DropAsync()
        {
            client.Close();
            return Task.CompletedTask;
        }

        public ValueTask DisposeAsync()
        {
            client.Dispose();
            return ValueTask.CompletedTask;
        }
    }
}
