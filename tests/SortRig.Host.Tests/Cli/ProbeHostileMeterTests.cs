using System.Net;
using System.Net.Sockets;
using System.Text;
using SortRig.Host.Cli;
using Spectre.Console;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// A meter whose *IDN? reply carries terminal escape sequences (set the window title, clear the screen):
/// probe shows them as \xNN and never writes the raw control characters to the terminal.
/// </summary>
public sealed class ProbeHostileMeterTests
{
    // ECMA-48 / xterm: ESC ] 0 ; text BEL sets the title, ESC [ 2 J clears the screen (from memory).
    private const string Hostile = "\u001b]0;owned\u0007\u001b[2JACME,SIM-6H,1,1.0";

    [Fact]
    public async Task Probe_IdentityWithEscapeCodes_ShownEscaped_NoControlCharacterReachesTheTerminal()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(60));
        var meter = ServeAsync(listener, stop.Token);
        var output = new StringWriter();
        var console = AnsiConsole.Create(
            new AnsiConsoleSettings { Out = new AnsiConsoleOutput(output), ColorSystem = ColorSystemSupport.NoColors }
        );

        await ProbeCommand.RunAsync(
            $"TCPIP::127.0.0.1::{((IPEndPoint)listener.LocalEndpoint).Port}::SOCKET",
            "simulator",
            console,
            stop.Token
        );
        await stop.CancelAsync();
        await meter;

        var text = output.ToString();
        Assert.Contains("\\x1B]0;owned\\x07\\x1B[2J", text, StringComparison.Ordinal);
        // cursor show/hide of the console itself
        Assert.DoesNotContain('\u001b', text.Replace("\u001b[?25", "", StringComparison.Ordinal));
        Assert.DoesNotContain('\u0007', text);
    }

    // Answers *IDN? with the hostile identity and any other query with 0, one reply per line, until stopped.
    private static async Task ServeAsync(TcpListener listener, CancellationToken ct)
    {
        try
        {
            while (!ct.IsCancellationRequested)
            {
                using var client = await listener.AcceptTcpClientAsync(ct);
                using var reader = new StreamReader(client.GetStream(), Encoding.ASCII);
                var writer = new StreamWriter(client.GetStream(), Encoding.ASCII) { AutoFlush = true, NewLine = "\n" };
                while (await reader.ReadLineAsync(ct) is { } line)
                {
                    foreach (var command in line.Split(';'))
                    {
                        if (command.Contains("IDN?", StringComparison.OrdinalIgnoreCase))
                        {
                            await writer.WriteLineAsync(Hostile);
                        }
                        else if (command.TrimEnd().EndsWith('?'))
                        {
                            await writer.WriteLineAsync(
                                command.Contains("ERR", StringComparison.OrdinalIgnoreCase) ? "0,\"No error\"" : "0"
                            );
                        }
                    }
                }
            }
        }
        catch (Exception e) when (e is OperationCanceledException or IOException or SocketException)
        {
            // The probe hung up or the test ended.
        }
    }
}
