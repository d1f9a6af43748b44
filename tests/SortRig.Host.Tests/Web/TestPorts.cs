using System.Net;
using System.Net.Sockets;

namespace SortRig.Host.Tests.Web;

/// <summary>Free TCP ports for a server that must be told its port before it binds.</summary>
internal static class TestPorts
{
    // Below Linux's ephemeral range (32768-60999), so no port 0 bind or outgoing connection
    // elsewhere in the test run can take it between this probe and the verb's own bind.
    public static int Free(bool anyAddress)
    {
        for (var attempt = 0; ; attempt++)
        {
            var port = Random.Shared.Next(20_000, 32_000);
            try
            {
                using var probe = new TcpListener(anyAddress ? IPAddress.Any : IPAddress.Loopback, port);
                probe.Start();
                return port;
            }
            catch (SocketException) when (attempt < 50)
            {
                // Taken; try another.
            }
        }
    }
}
