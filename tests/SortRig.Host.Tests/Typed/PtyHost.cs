using System.Diagnostics;
using System.Text;
using System.Text.RegularExpressions;
using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Typed;

/// <summary>
/// The built host run on a real pseudo-terminal: util-linux <c>script -q -e</c> gives the child a pty (its stdin is a
/// terminal, as at the bench) and returns the child's exit code; what the test writes goes to the terminal as typed
/// keys (Enter = CR, Ctrl+C = 0x03, which the terminal turns into SIGINT). Output lines are kept with escape sequences
/// and carriage returns removed.
/// </summary>
internal sealed partial class PtyHost : IAsyncDisposable
{
    private readonly Process _process;
    private readonly List<string> _lines = [];
    private readonly Task _reader;
    private readonly SemaphoreSlim _changed = new(0);

    private PtyHost(Process process)
    {
        _process = process;
        _reader = Task.Run(ReadAsync);
    }

    public static bool Available => File.Exists("/usr/bin/script");

    public IReadOnlyList<string> Lines
    {
        get
        {
            lock (_lines)
            {
                return [.. _lines];
            }
        }
    }

    public static PtyHost Start(
        string workDir,
        IReadOnlyList<string> args,
        IReadOnlyDictionary<string, string> environment
    )
    {
        var start = new ProcessStartInfo("script")
        {
            WorkingDirectory = workDir,
            RedirectStandardInput = true,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        foreach (
            var a in (string[])
                ["-q", "-e", "-c", $"exec dotnet {HostProcess.HostDll} {string.Join(' ', args)}", "/dev/null"]
        )
        {
            start.ArgumentList.Add(a);
        }

        foreach (var (k, v) in environment)
        {
            start.Environment[k] = v;
        }

        start.Environment["DOTNET_CLI_TELEMETRY_OPTOUT"] = "1";
        return new PtyHost(Process.Start(start) ?? throw new InvalidOperationException("script did not start"));
    }

    /// <summary>Types <paramref name="text"/> and Enter.</summary>
    public async Task TypeLineAsync(string text)
    {
        await _process.StandardInput.WriteAsync(text + "\r");
        await _process.StandardInput.FlushAsync();
    }

    /// <summary>Ctrl+C on the terminal.</summary>
    public async Task CtrlCAsync()
    {
        await _process.StandardInput.WriteAsync("\u0003");
        await _process.StandardInput.FlushAsync();
    }

    /// <summary>Waits until a line after the first <paramref name="from"/> lines matches; returns its index.</summary>
    public async Task<int> WaitForAsync(Func<string, bool> match, int from, TimeSpan limit)
    {
        using var deadline = new CancellationTokenSource(limit);
        while (true)
        {
            var lines = Lines;
            for (var i = from; i < lines.Count; i++)
            {
                if (match(lines[i]))
                {
                    return i;
                }
            }

            try
            {
                await _changed.WaitAsync(deadline.Token);
            }
            catch (OperationCanceledException)
            {
                throw new TimeoutException(
                    $"no matching line within {limit}; last lines:\n{string.Join('\n', lines.TakeLast(15))}"
                );
            }
        }
    }

    public async Task<int> WaitForExitAsync(TimeSpan limit)
    {
        using var deadline = new CancellationTokenSource(limit);
        await _process.WaitForExitAsync(deadline.Token);
        await _reader;
        return _process.ExitCode;
    }

    public async ValueTask DisposeAsync()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
            await _process.WaitForExitAsync();
        }

        _process.Dispose();
        _changed.Dispose();
    }

    private async Task ReadAsync()
    {
        var pending = new StringBuilder();
        var buffer = new char[4096];
        int n;
        while ((n = await _process.StandardOutput.ReadAsync(buffer)) > 0)
        {
            pending.Append(buffer, 0, n);
            var text = pending.ToString();
            var end = text.LastIndexOf('\n');
            if (end < 0)
            {
                continue;
            }

            pending.Clear().Append(text[(end + 1)..]);
            var lines = text[..end]
                .Split('\n')
                .Select(l => Escapes().Replace(l, "").Replace("\r", "", StringComparison.Ordinal));
            lock (_lines)
            {
                _lines.AddRange(lines);
            }

            _changed.Release();
        }

        if (pending.Length > 0)
        {
            lock (_lines)
            {
                _lines.Add(Escapes().Replace(pending.ToString(), "").Replace("\r", "", StringComparison.Ordinal));
            }
        }

        _changed.Release();
    }

    [GeneratedRegex(@"\x1b(\[[0-9;?]*[A-Za-z]|[=>])")]
    private static partial Regex Escapes();
}
