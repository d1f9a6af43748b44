using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Cli;

/// <summary>With --web the sort verb says where the bench page is, before anything else.</summary>
public sealed class SortWebAddressTests
{
    [Fact]
    public async Task Sort_Web_PrintsThePageAddressFirst()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-web-");
        try
        {
            var run = await HostProcess.RunAsync(
                dir.FullName,
                [
                    "sort",
                    "--parts",
                    "2",
                    "--speed",
                    "20",
                    "--plain",
                    "--no-speech",
                    "--web",
                    "--web-urls",
                    "http://127.0.0.1:0",
                    "--db",
                    "w.db",
                ],
                null,
                null,
                null,
                TimeSpan.FromMinutes(2)
            );

            Assert.Equal(0, run.ExitCode);
            Assert.Equal("bench page: http://127.0.0.1:0", run.Lines[0]);
        }
        finally
        {
            dir.Delete(recursive: true);
        }
    }
}
