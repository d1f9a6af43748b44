using System.Diagnostics;
using System.Globalization;
using System.Text.RegularExpressions;
using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// Ctrl+C in the middle of a sort, as a terminal sends it (SIGINT to the process): the verb stops with
/// exit code 130, says what was kept and prints the command that carries on; that command, run as
/// printed, finishes the reel with no part lost or doubled.
/// </summary>
public sealed partial class SortInterruptTests
{
    [Fact]
    public async Task Sort_CtrlC_Exit130_PrintsResumeCommand_ThatFinishesTheReel()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-ctrlc-");
        try
        {
            // The reel is long enough that the interrupt, sent after part 3, lands before its end even when a
            // loaded machine is slow to start `kill` (8 parts once finished first, at about 0.4 s a part; 24 parts
            // finished first once the predictive settle rule became the default, which accepts sooner).
            string[] args = ["sort", "--parts", "48", "--speed", "20", "--plain", "--no-speech", "--db", "ctrlc.db"];
            var (exit1, lines1) = await RunAsync(dir.FullName, args, interruptAfterPart: 3);
            Assert.Equal(130, exit1);
            var hint = Assert.Single(lines1, l => l.StartsWith("to go on: sortrig sort", StringComparison.Ordinal));
            Assert.Contains("--session bench", hint, StringComparison.Ordinal);
            var first = Announced(lines1);
            Assert.InRange(first.Count, 3, 47);

            var resume = hint["to go on: sortrig ".Length..].Split(' ', StringSplitOptions.RemoveEmptyEntries);
            var (exit2, lines2) = await RunAsync(dir.FullName, resume, interruptAfterPart: null);
            Assert.Equal(0, exit2);
            var second = Announced(lines2);
            Assert.Empty(first.Intersect(second));
            Assert.Equal(Enumerable.Range(1, 48), first.Concat(second).Order());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    private static List<int> Announced(IEnumerable<string> lines) =>
        [
            .. lines
                .Select(l => PartLine().Match(l))
                .Where(m => m.Success)
                .Select(m => int.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture)),
        ];

    private static async Task<(int Exit, List<string> Lines)> RunAsync(
        string dir,
        IReadOnlyList<string> args,
        int? interruptAfterPart
    )
    {
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = dir,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(HostProcess.HostDll);
        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        using var process = Process.Start(start)!;
        _ = process.StandardError.ReadToEndAsync();
        using var deadline = new CancellationTokenSource(TimeSpan.FromMinutes(3));
        var lines = new List<string>();
        var sent = false;
        while (await process.StandardOutput.ReadLineAsync(deadline.Token) is { } line)
        {
            lines.Add(line);
            if (!sent && interruptAfterPart is { } n && Announced([line]).SingleOrDefault() >= n)
            {
                sent = true;
                using var kill = Process.Start("kill", ["-INT", process.Id.ToString(CultureInfo.InvariantCulture)])!;
                await kill.WaitForExitAsync(deadline.Token);
            }
        }

        await process.WaitForExitAsync(deadline.Token);
        return (process.ExitCode, lines);
    }

    [GeneratedRegex(@"^part (\d+): cup ")]
    private static partial Regex PartLine();
}
