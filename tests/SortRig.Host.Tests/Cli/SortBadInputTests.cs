using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>
/// The sort verb as a new user meets it, run as a process: a bad value is one line naming the flag as
/// typed, exit code 2, no stack trace, and nothing is started or created (no database, no log folder).
/// </summary>
public sealed class SortBadInputTests
{
    [Theory]
    [InlineData("--match", "0", "--match")]
    [InlineData("--cups", "0", "--cups")]
    [InlineData("--nominal", "abc", "--nominal")]
    [InlineData("--resource", "foo", "--resource")]
    [InlineData("--assigner", "biggest", "--assigner")]
    [InlineData("--tolerance", "1 percent", "--tolerance")]
    [InlineData("--settle", "guess", "--settle")]
    [InlineData("--physics", "quantum", "--physics")]
    [InlineData("--db", "/dev/null", "--db")] // a device: SQLite would leave a journal beside it
    [InlineData("--db", "/no-such-folder-sortrig/bench.db", "--db")] // was: two stack traces ending in "unable to open database file"
    [InlineData("--db", "/proc/bench.db", "--db")] // a folder that cannot be written, even by root
    public async Task Sort_BadValue_OneLineNamingTheFlag_Exit2_NothingCreated(string flag, string value, string named)
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-badinput-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName, ["sort", flag, value, "--plain", "--no-speech"], null, null, null, TimeSpan.FromSeconds(60));

            Assert.Equal(2, run.ExitCode);
            var lines = run.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            var line = Assert.Single(lines);
            Assert.StartsWith("error: " + named + ":", line, StringComparison.Ordinal);
            Assert.Contains(value, line, StringComparison.Ordinal);
            Assert.DoesNotContain(run.Lines, l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal));
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public async Task Sort_SpeedWithARealMeter_Refused_Exit2()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-badinput-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName, ["sort", "--speed", "5", "--resource", "TCPIP::127.0.0.1::5025::SOCKET"], null, null, null,
                TimeSpan.FromSeconds(60));

            Assert.Equal(2, run.ExitCode);
            Assert.StartsWith("error: --speed:", run.Log.Trim(), StringComparison.Ordinal);
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Fact]
    public async Task Sort_PhysicsWithARealMeter_Refused_Exit2()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-badinput-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName, ["sort", "--physics", "rich", "--resource", "TCPIP::127.0.0.1::5025::SOCKET"], null, null, null,
                TimeSpan.FromSeconds(60));

            Assert.Equal(2, run.ExitCode);
            Assert.StartsWith("error: --physics:", run.Log.Trim(), StringComparison.Ordinal);
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
