using System.Diagnostics;

namespace SortRig.Tests.Support;

/// <summary>
/// A real pseudo-terminal pair made by socat (pty,raw,echo=0 on both ends), so serial links are
/// tested through the kernel's tty layer. Ends are symlinks /tmp/sortrig-&lt;id&gt;A and ...B.
/// </summary>
internal sealed class SocatPair : IAsyncDisposable
{
    private readonly Process _process;

    private SocatPair(Process process, string endA, string endB)
    {
        _process = process;
        EndA = endA;
        EndB = endB;
    }

    public string EndA { get; }

    public string EndB { get; }

    /// <summary>Whether socat is on the PATH.</summary>
    public static bool Available => Which("socat") is not null;

    /// <summary>Null when socat can be used; otherwise why tests needing it are skipped. On CI (CI=true) never
    /// skipped.</summary>
    public static string? SkipReason() =>
        Available || Environment.GetEnvironmentVariable("CI") == "true"
            ? null
            : "socat is not installed (apt-get install socat); serial link tests need a pseudo-terminal pair";

    public static async Task<SocatPair> StartAsync()
    {
        var socat = Which("socat")
            ?? throw new InvalidOperationException("socat is not installed; on CI it must be (see .ci/run)");
        var id = Guid.NewGuid().ToString("N")[..12];
        var (a, b) = ($"/tmp/sortrig-{id}A", $"/tmp/sortrig-{id}B");
        var info = new ProcessStartInfo(socat)
        {
            RedirectStandardError = true,
            RedirectStandardOutput = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add($"pty,raw,echo=0,link={a}");
        info.ArgumentList.Add($"pty,raw,echo=0,link={b}");
        var process = Process.Start(info) ?? throw new InvalidOperationException("socat did not start");
        for (var i = 0; i < 100 && !(File.Exists(a) && File.Exists(b)); i++)
        {
            await Task.Delay(20);
        }

        return File.Exists(a) && File.Exists(b)
            ? new SocatPair(process, a, b)
            : throw new InvalidOperationException(
                $"socat made no pty pair: {await process.StandardError.ReadToEndAsync()}"
            );
    }

    /// <summary>Ends socat: both pseudo-terminals hang up, as when a USB-serial cable is pulled.</summary>
    public async Task StopAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill();
            await _process.WaitForExitAsync();
        }
    }

    public async ValueTask DisposeAsync()
    {
        await StopAsync();
        _process.Dispose();
        File.Delete(EndA); // a killed socat leaves its pty links behind
        File.Delete(EndB);
    }

    private static string? Which(string name) =>
        (Environment.GetEnvironmentVariable("PATH") ?? string.Empty)
            .Split(':')
            .Select(dir => Path.Combine(dir, name))
            .FirstOrDefault(File.Exists);
}
