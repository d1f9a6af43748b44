using SortRig.Host.Tests.Cli;

namespace SortRig.Host.Tests.Building;

/// <summary>
/// Bad build options on the sort verb, run as a process: one line naming the flag, exit code 2, no stack trace, nothing
/// created (<see cref="BadInput"/>).
/// </summary>
public sealed class BuildBadInputTests
{
    [Theory]
    [InlineData("--sets", new[] { "--sets", "2" }, "sets of what")]
    [InlineData("--sets", new[] { "--recipe", "@quad", "--sets", "65" }, "out of range")]
    [InlineData("--recipe", new[] { "--recipe", "no-such-recipe" }, "no file 'no-such-recipe'")]
    [InlineData("--recipe", new[] { "--recipe", "@broken" }, "expected")]
    [InlineData(
        "--nominal",
        new[] { "--recipe", "@quad", "--nominal", "4.7k" },
        "is not a nominal recipe 'quad-bad' takes (10k"
    )]
    [InlineData("--sets-csv", new[] { "--recipe", "@quad", "--sets-csv", "/no/such/folder/sets.csv" }, "no folder")]
    public Task Sort_BadBuildOption_OneLineNamingTheFlag_Exit2_NothingCreated(
        string named,
        string[] args,
        string says
    ) => BadInput.AssertRefusedAsync(["sort", .. args, "--plain", "--no-speech"], named, says, async folder =>
        {
            var quad = Path.Combine(folder, "quad.yaml");
            await File.WriteAllTextAsync(
                quad,
                """
                recipe: quad-bad
                form: matched
                match-ppm: 1000
                base: 10k
                positions:
                  - { name: R1, ratio: 1 }
                  - { name: R2, ratio: 1 }
                """
            );
            var broken = Path.Combine(folder, "broken.yaml");
            await File.WriteAllTextAsync(broken, "recipe: broken\nform: matched\npositions: []\n");
            return a =>
                a == "@quad" ? quad
                : a == "@broken" ? broken
                : a;
        });
}
