using System.Diagnostics;

namespace SortRig.Simulator.Tests.Support;

/// <summary>A real pseudo-terminal pair made by socat; disposing kills that socat process.</summary>
internal sealed class SocatPair : IDisposable
{
    private readonly Process _process;

    private SocatPair(Process process, string a, string b) => (_process, DeviceSide, ClientSide) = (process, a, b);

    public string DeviceSide { get; }

    public string ClientSide { get; }

    public static bool Available => File.Exists("/usr/bin/socat") || File.Exists("/usr/local/bin/socat");

    public static async Task<SocatPair> StartAsync()
    {
        var id = Guid.NewGuid().ToString("N")[..8];
        var (a, b) = ($"/tmp/sortrig-sim-{id}-dev", $"/tmp/sortrig-sim-{id}-cli");
        var start = new ProcessStartInfo("socat", $"pty,raw,echo=0,link={a} pty,raw,echo=0,link={b}")
        {
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        var process = Process.Start(start) ?? throw new InvalidOperationException("socat did not start");
        var deadline = DateTime.UtcNow + TimeSpan.FromSeconds(5);
        while (!(File.Exists(a) && File.Exists(b)))
        {
            if (DateTime.UtcNow > deadline || process.HasExited)
            {
                process.Kill();
                throw new InvalidOperationException("socat did not create the pty pair: " + await process.StandardError.ReadToEndAsync());
            }

            await Task.Delay(10);
        }

        return new SocatPair(process, a, b);
    }

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill();
            _process.WaitForExit(2000);
        }

        _process.Dispose();
        File.Delete(DeviceSide); // a killed socat leaves its pty links behind
        File.Delete(ClientSide);
    }
}

/// <summary>A fact that needs socat: skipped only when socat is absent and CI is not "true" (in CI it must run, and fails).</summary>
public sealed class SocatFactAttribute : FactAttribute
{
    public SocatFactAttribute()
    {
        if (!SocatPair.Available && Environment.GetEnvironmentVariable("CI") != "true")
        {
            Skip = "socat is not installed (apt-get install socat)";
        }
    }
}
