using System.CommandLine;
using SortRig.Engine.Picking;
using SortRig.Host.LibraryVerb;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The plan verb: reads a saved session and a recipe, prints the pick list per set and exports it as
/// CSV.</summary>
internal static class PlanCommand
{
    public static Command Create(IAnsiConsole? console = null)
    {
        var command = new Command(
            "plan",
            "Plan the sets of a recipe from a saved session: print the pick list (parts or cups, outputs, errors) "
                + "and export it as CSV."
        );
        var db = CliOptions.Database();
        var session = new Option<string>("--session")
        {
            Description = "Session name (newest with that name) or id",
            Required = true,
        };
        var recipe = CliOptions.Recipe();
        var csv = new Option<string?>("--csv") { Description = "Export the pick list to this CSV file" };
        var take = new Option<string?>("--take", "--by")
        {
            Description =
                "Take the picked parts from the library for this person (all or none); --by as in library take",
        };
        var pick = CliOptions.Pick();
        var timeLimit = new Option<double?>("--time-limit")
        {
            Description =
                "Seconds the set search may run on a large reel (default 10, 0.1 to 3600); the best plan so far is "
                + "returned with its bound",
        };
        foreach (var o in new Option[] { db, session, recipe, csv, take, pick, timeLimit })
        {
            command.Add(o);
        }

        command.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(console ?? AnsiConsole.Console, () =>
                    PlanRunner.RunAsync(
                        new PlanRequest(
                            r.GetValue(db)!,
                            r.GetValue(session)!,
                            r.GetValue(recipe)!,
                            r.GetValue(csv),
                            r.GetValue(take),
                            CliOptions.ParsePick(r.GetValue(pick)),
                            TimeLimit(r.GetValue(timeLimit))
                        ),
                        console ?? AnsiConsole.Console,
                        ct
                    )
                )
        );
        return command;
    }

    private static TimeSpan? TimeLimit(double? seconds) =>
        seconds switch
        {
            null => null,
            >= 0.1 and <= 3600 => TimeSpan.FromSeconds(seconds.Value),
            _ => throw new VerbException(
                FormattableString.Invariant($"--time-limit: {seconds} s is outside 0.1 to 3600 s")
            ),
        };
}
