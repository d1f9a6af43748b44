using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Typed;

/// <summary>A typed meter's setup problems are one line naming --resource, exit code 2, before any database is
/// made.</summary>
public sealed class TypedBadInputTests
{
    [Theory]
    [InlineData("TYPED::no-such-meter", "10k", "No typed-meter profile 'no-such-meter'")]
    [InlineData("TYPED::handheld-typed", "100M", "no range of handheld-typed shows")]
    [InlineData("TYPED::bad name", "10k", "typed-meter profile name")]
    public async Task Sort_TypedResourceProblem_OneLine_Exit2_NothingCreated(
        string resource,
        string nominal,
        string words
    )
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-typed-bad-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                ["sort", "--resource", resource, "--nominal", nominal, "--no-speech"],
                null,
                null,
                null,
                TimeSpan.FromSeconds(60)
            );

            Assert.Equal(2, run.ExitCode);
            var line = Assert.Single(
                run.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
            );
            Assert.StartsWith("error: --resource:", line, StringComparison.Ordinal);
            Assert.Contains(words, line, StringComparison.Ordinal);
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }

    [Theory]
    [InlineData("--agree", "3")]
    [InlineData("--gap", "1")]
    public async Task Sort_TypedOnlyFlag_WithoutTypedMeter_OneLine_Exit2(string flag, string value)
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-typed-bad-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                ["sort", flag, value, "--plain", "--no-speech"],
                null,
                null,
                null,
                TimeSpan.FromSeconds(60)
            );

            Assert.Equal(2, run.ExitCode);
            var line = Assert.Single(
                run.Log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)
            );
            Assert.Equal($"error: {flag}: applies to a typed meter (--resource TYPED::profile) only", line);
            Assert.Empty(dir.GetFileSystemInfos());
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
