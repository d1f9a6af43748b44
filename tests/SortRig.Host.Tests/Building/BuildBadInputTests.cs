using SortRig.Host.Tests.Reliability.Support;

namespace SortRig.Host.Tests.Building;

/// <summary>
/// Bad build options on the sort verb, run as a process: one line naming the flag, exit code 2, no stack trace, nothing
/// created (SortRig's rule for bad input; common practice, no source).
/// </summary>
public sealed class BuildBadInputTests
{
    [Theory]
    [InlineData("--sets", new[] { "--sets", "2" }, "sets of what")]
    [InlineData("--sets", new[] { "--recipe", "@quad", "--sets", "65" }, "out of range")]
    [InlineData("--recipe", new[] { "--recipe", "no-such-recipe" }, "no file 'no-such-recipe'")]
    [InlineData("--recipe", new[] { "--recipe", "@broken" }, "expected")]
    [InlineData("--nominal", new[] { "--recipe", "@quad", "--nominal", "4.7k" }, "is not a nominal recipe 'quad-bad' takes (10k")]
    [InlineData("--sets-csv", new[] { "--recipe", "@quad", "--sets-csv", "/no/such/folder/sets.csv" }, "no folder")]
    public async Task Sort_BadBuildOption_OneLineNamingTheFlag_Exit2_NothingCreated(string named, string[] args, string says)
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-buildbad-");
        var recipes = Directory.CreateTempSubdirectory("sortrig-buildbad-recipes-");
        try
        {
            var quad = Path.Combine(recipes.FullName, "quad.yaml");
            await File.WriteAllTextAsync(quad, "recipe: quad-bad\nform: matched\nmatch-ppm: 1000\nbase: 10k\npositions:\n  - { name: R1, ratio: 1 }\n  - { name: R2, ratio: 1 }\n");
            var broken = Path.Combine(recipes.FullName, "broken.yaml");
            await File.WriteAllTextAsync(broken, "recipe: broken\nform: matched\npositions: []\n");
            var resolved = args.Select(a => a == "@quad" ? quad : a == "@broken" ? broken : a).ToList();

            var run = await HostProcess.RunAsync(dir.FullName, ["sort", .. resolved, "--plain", "--no-speech"], null, null, null, TimeSpan.FromSeconds(60));

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
            recipes.Delete(recursive: true);
        }
    }
}
