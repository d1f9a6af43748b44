using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Checking;

/// <summary>The check standard's flags on the sort verb: a bad value is one line naming the flag, exit code 2, nothing
/// started or created.</summary>
public sealed class CheckBadInputTests
{
    [Theory]
    [InlineData(new[] { "--check", "volts:10" }, "--check", "volts:10")]
    [InlineData(new[] { "--check", "fixture:ten" }, "--check", "fixture:ten")]
    [InlineData(new[] { "--check", "library:-3" }, "--check", "library:-3")]
    [InlineData(new[] { "--check", "fixture:10000", "--check-every", "-1" }, "--check-every", "-1")]
    [InlineData(new[] { "--check", "fixture:10000", "--check-every", "0" }, "--check-every", "--check-minutes")]
    [InlineData(new[] { "--check", "fixture:10000", "--check-minutes", "9999" }, "--check-minutes", "9999")]
    [InlineData(new[] { "--check-every", "10" }, "--check-every", "--check")]
    [InlineData(new[] { "--check", "fixture:10000", "--check-value", "abc" }, "--check-value", "abc")]
    public async Task Sort_BadCheckValue_OneLineNamingTheFlag_Exit2_NothingCreated(
        string[] args,
        string named,
        string said
    )
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-badcheck-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                ["sort", .. args, "--plain", "--no-speech"],
                null,
                null,
                null,
                TimeSpan.FromSeconds(60)
            );

            Assert.Equal(2, run.ExitCode);
            var line = Assert.Single(
                run.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
            );
            Assert.StartsWith("error: " + named + ":", line, StringComparison.Ordinal);
            Assert.Contains(said, line, StringComparison.Ordinal);
            Assert.DoesNotContain(run.Lines, l => l.TrimStart().StartsWith("at ", StringComparison.Ordinal));
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
