using System.Net;
using System.Net.Sockets;
using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// A meter that was never reached (nothing listening at the address, a serial device that is not there): the sort
/// stops after a few quick attempts with one plain line naming what was tried and what to check, instead of
/// retrying forever as if a connection had been lost; no stack trace on the terminal.
/// </summary>
public sealed class SortUnreachableMeterTests
{
    [Fact]
    public async Task Sort_NothingListeningAtTheAddress_StopsQuicklyNamingTheAddress()
    {
        // A port that was free a moment ago: bound, read, released.
        var probe = new TcpListener(IPAddress.Loopback, 0);
        probe.Start();
        var port = ((IPEndPoint)probe.LocalEndpoint).Port;
        probe.Stop();

        var (run, logFile) = await RunAsync($"TCPIP::127.0.0.1::{port}::SOCKET");

        Assert.Equal(1, run.ExitCode);
        var said = string.Join(' ', run.Lines);
        Assert.Contains($"cannot reach the meter: tcp://127.0.0.1:{port}", said, StringComparison.Ordinal);
        Assert.Contains("4 attempts", said, StringComparison.Ordinal);
        Assert.DoesNotContain("connection lost", said, StringComparison.Ordinal);
        AssertNoStackTrace(run);
        // Each failed attempt is told once, in the operator's words; the log's warning of it goes to the log file only.
        var retries = run.Lines.Count(l => l.Contains("trying again in", StringComparison.Ordinal));
        Assert.InRange(retries, 1, 4);
        Assert.DoesNotContain("Meter fault", run.Log, StringComparison.Ordinal);
        Assert.Equal(retries, logFile.Split('\n').Count(l => l.Contains("Meter fault", StringComparison.Ordinal)));
    }

    [Fact]
    public async Task Sort_SerialDeviceThatIsNotThere_SaysNoSuchDevice()
    {
        var (run, _) = await RunAsync("ASRL::/dev/ttyUSB-absent-42::INSTR");

        Assert.Equal(1, run.ExitCode);
        var said = string.Join(' ', run.Lines);
        Assert.Contains("no such device '/dev/ttyUSB-absent-42'", said, StringComparison.Ordinal);
        Assert.DoesNotContain("denied", said, StringComparison.OrdinalIgnoreCase);
        AssertNoStackTrace(run);
    }

    private static async Task<(HostRun Run, string LogFile)> RunAsync(string resource)
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-unreached-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                ["sort", "--resource", resource, "--plain", "--no-speech", "--profile", "bench-5half", "--nplc", "2"],
                null,
                null,
                null,
                TimeSpan.FromSeconds(90)
            );
            var logs = Path.Combine(dir.FullName, "logs");
            var logFile = Directory.Exists(logs)
                ? string.Concat(Directory.GetFiles(logs).Order().Select(File.ReadAllText))
                : "";
            return (run, logFile);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    private static void AssertNoStackTrace(HostRun run)
    {
        Assert.DoesNotContain(run.Lines, l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal));
        Assert.DoesNotContain(run.Log.Split('\n'), l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal));
    }
}
