using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// SortRig's rule for bad input, checked on the program run as a process in an empty folder: one line naming the flag
/// as typed, exit code 2, no stack trace, and nothing started or created (common practice, no source).
/// </summary>
internal static class BadInput
{
    /// <summary>Runs <c>sortrig</c> with <paramref name="args"/> and checks the rule: the line starts
    /// "error: <paramref name="named"/>:" and contains <paramref name="says"/>.</summary>
    /// <param name="setUp">Writes files the arguments name into a folder of their own, and returns how to map the
    /// arguments to them.</param>
    public static async Task AssertRefusedAsync(
        IReadOnlyList<string> args,
        string named,
        string says,
        Func<string, Task<Func<string, string>>>? setUp = null
    )
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-badinput-");
        var files = Directory.CreateTempSubdirectory("sortrig-badinput-files-");
        try
        {
            var map = setUp is null ? (a => a) : await setUp(files.FullName);

            var run = await HostProcess.RunAsync(
                dir.FullName,
                [.. args.Select(map)],
                null,
                null,
                null,
                TimeSpan.FromSeconds(60)
            );

            Assert.Equal(2, run.ExitCode);
            var lines = run.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var line = Assert.Single(lines);
            Assert.StartsWith("error: " + named + ":", line, StringComparison.Ordinal);
            Assert.Contains(says, line, StringComparison.Ordinal);
            Assert.DoesNotContain(run.Lines, l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal));
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
            files.Delete(recursive: true);
        }
    }
}
