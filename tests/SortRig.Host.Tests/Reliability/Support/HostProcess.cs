using System.Diagnostics;

namespace SortRig.Host.Tests.Reliability.Support;

/// <summary>One run of the built host as a separate process: its exit code, every stdout line (announcements) and its
/// log (stderr).</summary>
internal sealed record HostRun(int ExitCode, IReadOnlyList<string> Lines, string Log)
{
    /// <summary>128 + 9: the process died of SIGKILL.</summary>
    public bool DiedOfSigkill => ExitCode == 137;
}

/// <summary>
/// Runs SortRig.Host.dll (copied next to the test assembly by the project reference) with
/// <c>dotnet</c>, optionally under <c>strace</c> for syscall-level crash injection, and can kill it
/// with SIGKILL when a given stdout line has been seen.
/// </summary>
internal static class HostProcess
{
    public static string HostDll => Path.Combine(AppContext.BaseDirectory, "SortRig.Host.dll");

    public static bool StraceAvailable => File.Exists("/usr/bin/strace") || File.Exists("/bin/strace");

    /// <param name="workDir">Working directory (the host writes its log folder there).</param>
    /// <param name="args">Arguments after the dll.</param>
    /// <param name="crashAt">SORTRIG_CRASH_AT for this run, or null.</param>
    /// <param name="strace">strace arguments to run the host under, or null.</param>
    /// <param name="killAfter">Given each stdout line, a delay after which to SIGKILL the process, or null to let it
    /// run.</param>
    /// <param name="limit">Wall-time limit; the process is killed and the run fails past it.</param>
    public static async Task<HostRun> RunAsync(
        string workDir,
        IReadOnlyList<string> args,
        string? crashAt,
        IReadOnlyList<string>? strace,
        Func<string, TimeSpan?>? killAfter,
        TimeSpan limit
    )
    {
        var start = strace is null ? new ProcessStartInfo("dotnet") : new ProcessStartInfo("strace");
        foreach (var a in strace ?? [])
        {
            start.ArgumentList.Add(a);
        }

        if (strace is not null)
        {
            start.ArgumentList.Add("dotnet");
        }

        start.ArgumentList.Add(HostDll);
        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        start.WorkingDirectory = workDir;
        start.RedirectStandardOutput = true;
        start.RedirectStandardError = true;
        start.RedirectStandardInput = true; // no keyboard: the host must not wait on the console
        start.UseShellExecute = false;
        start.Environment["SORTRIG_CRASH_AT"] = crashAt ?? "";
        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";

        using var process = Process.Start(start) ?? throw new InvalidOperationException("dotnet did not start");
        var lines = new List<string>();
        var killScheduled = false;
        var stderr = process.StandardError.ReadToEndAsync();
        using var deadline = new CancellationTokenSource(limit);
        try
        {
            while (await process.StandardOutput.ReadLineAsync(deadline.Token) is { } line)
            {
                lock (lines)
                {
                    lines.Add(line);
                }

                if (!killScheduled && killAfter?.Invoke(line) is { } delay)
                {
                    killScheduled = true;
                    _ = Task.Delay(delay).ContinueWith(_ => KillQuietly(process), TaskScheduler.Default);
                }
            }

            await process.WaitForExitAsync(deadline.Token);
        }
        catch (OperationCanceledException) when (deadline.IsCancellationRequested)
        {
            KillQuietly(process);
            throw new TimeoutException($"host did not end within {limit}: {string.Join('\n', lines.TakeLast(20))}");
        }

        var log = await stderr;
        lock (lines)
        {
            return new HostRun(process.ExitCode, [.. lines], log);
        }
    }

    private static void KillQuietly(Process process)
    {
        try
        {
            process.Kill(entireProcessTree: true); // SIGKILL
        }
        catch (InvalidOperationException)
        {
            // Already gone.
        }
    }
}
