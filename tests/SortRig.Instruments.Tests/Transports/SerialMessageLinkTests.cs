using System.IO.Ports;
using System.Text;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Tests.Support;
using SortRig.Instruments.Transports;
using SortRig.Tests.Support;

namespace SortRig.Instruments.Tests.Transports;

/// <summary>
/// The link contract over a real socat pseudo-terminal pair, SerialPort on both ends. Skipped
/// only when socat is absent and CI is not "true"; on CI a missing socat fails the tests.
/// </summary>
[RequiresSocat]
public sealed class SerialMessageLinkTests : MessageLinkContractTests
{
    protected override async Task<LinkUnderTest> CreateLinkAsync(MessageLinkOptions options)
    {
        var pair = await SocatPair.StartAsync();
        var resource = ResourceStringParser.Parse(
            $"ASRL::{pair.EndA}::INSTR?baud=115200&parity=none&data=8&stop=1&flow=none"
        );
        var link = await new MessageLinkFactory().OpenAsync(resource, options, null, CancellationToken.None);
        var far = new SerialPort(pair.EndB, 115200, Parity.None, 8, StopBits.One);
        far.Open();
        return new LinkUnderTest(link, new PtyPeer(pair, far));
    }

    private sealed class PtyPeer(SocatPair pair, SerialPort port) : ILinkPeer
    {
        public Task SendAsync(string text) => port.BaseStream.WriteAsync(Encoding.Latin1.GetBytes(text)).AsTask();

        public Task<string> ReceiveAsync(int length) => ReceiveExactlyAsync(port.BaseStream, length);

        public async Task DropAsync()
        {
            port.Close();
            await pair.StopAsync();
        }

        public async ValueTask DisposeAsync()
        {
            port.Dispose();
            await pair.DisposeAsync();
        }
    }
}
