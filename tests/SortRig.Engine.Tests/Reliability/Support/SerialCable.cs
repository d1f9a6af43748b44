using System.Diagnostics;

namespace SortRig.Engine.Tests.Reliability.Support;

/// <summary>
/// A serial line made of real pseudo-terminals: socat joins the meter's end and a middle end; a
/// second socat (the "cable") joins the middle end to the end the host opens. Pulling the cable
/// kills the second socat (the host's port dies under it, like an unplugged USB adapter);
/// plugging it back starts it again at the same path, so the host can reopen its port.
/// </summary>
internal sealed class SerialCable : IAsyncDisposable
{
    private readonly Process _pair;
    private readonly string _middle;
    private Process? _cable;

    private SerialCable(Process pair, string meterSide, string middle, string hostSide)
    {
        _pair = pair;
        MeterSide = meterSide;
        _middle = middle;
        HostSide = hostSide;
    }

    public static bool Available => File.Exists("/usr/bin/socat") || File.Exists("/usr/local/bin/socat");

    /// <summary>The path the simulated meter serves on.</summary>
    public string MeterSide { get; }

    /// <summary>The path the host opens (ASRL::path::INSTR).</summary>
    public string HostSide { get; }

    /// <summary>How many times the cable was pulled.</summary>
    public int Pulls { get; private set; }

    public static async Task<SerialCable> StartAsync()
    {
        var id = Guid.NewGuid().ToString("N")[..8];
        var (meter, middle, host) = (
            $"/tmp/sortrig-rel-{id}-meter",
            $"/tmp/sortrig-rel-{id}-mid",
            $"/tmp/sortrig-rel-{id}-host"
        );
        var pair = Socat($"pty,raw,echo=0,link={meter}", $"pty,raw,echo=0,link={middle}");
        await WaitForAsync(pair, meter, middle);
        var cable = new SerialCable(pair, meter, middle, host);
        await cable.PlugInAsync();
        return cable;
    }

    /// <summary>Kills the cable socat with SIGKILL: the host's end of the line disappears.</summary>
    public async Task PullAsync()
    {
        if (_cable is { } cable)
        {
            cable.Kill();
            await cable.WaitForExitAsync();
            cable.Dispose();
            _cable = null;
            File.Delete(HostSide);
            Pulls++;
        }
    }

    /// <summary>Starts the cable socat again: the host's path exists again (a new pseudo-terminal).</summary>
    public async Task PlugInAsync()
    {
        File.Delete(HostSide);
        _cable = Socat($"{_middle},raw,echo=0", $"pty,raw,echo=0,link={HostSide}");
        await WaitForAsync(_cable, HostSide);
    }

    public async ValueTask DisposeAsync()
    {
        await PullAsync();
        if (!_pair.HasExited)
        {
            _pair.Kill();
            await _pair.WaitForExitAsync();
        }

        _pair.Dispose();
        File.Delete(MeterSide);
        File.Delete(_middle);
    }

    private static Process Socat(string a, string b)
    {
        var start = new ProcessStartInfo("socat") { RedirectStandardError = true, UseShellExecute = false };
        start.ArgumentList.Add(a);
        start.ArgumentList.Add(b);
        return Process.Start(start) ?? throw new InvalidOperationException("socat did not start");
    }

    private static async Task WaitForAsync(Process process, params string[] paths)
    {
        var deadline = Stopwatch.StartNew();
        while (!paths.All(File.Exists))
        {
            if (deadline.Elapsed > TimeSpan.FromSeconds(5) || process.HasExited)
            {
                throw new InvalidOperationException(
                    "socat did not create "
                        + string.Join(", ", paths)
                        + ": "
                        + await process.StandardError.ReadToEndAsync()
                );
            }

            await Task.Delay(5);
        }
    }
}
