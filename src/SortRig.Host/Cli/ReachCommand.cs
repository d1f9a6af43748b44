using System.CommandLine;
using SortRig.Host.OrderVerb;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The reach verb: the tightest match at which the parts on hand still make N sets, and the extra part that
/// adds one.</summary>
internal static class ReachCommand
{
    public static Command Create(IAnsiConsole? console = null)
    {
        var command = new Command(
            "reach",
            "From the parts on hand (a session or the library), find the tightest match at which N sets can still be "
                + "built, and which single extra part would make one more set."
        );
        var db = CliOptions.Database();
        var session = new Option<string?>("--session")
        {
            Description = "Session name (newest with that name) or id; default the library's available parts",
        };
        var recipe = CliOptions.Recipe();
        var sets = new Option<int>("--sets") { Description = "Sets to build (1 to 10 000)", Required = true };
        var timeLimit = new Option<double?>("--time-limit")
        {
            Description =
                "Seconds of set search per assembler run (0.01 to 60); default none: the fast sweep, repeatable",
        };
        foreach (var o in new Option[] { db, session, recipe, sets, timeLimit })
        {
            command.Add(o);
        }

        command.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(console ?? AnsiConsole.Console, () =>
                    ReachRunner.RunAsync(
                        new ReachRequest(
                            r.GetValue(db)!,
                            r.GetValue(session),
                            r.GetValue(recipe)!,
                            r.GetValue(sets),
                            OrderCommand.TimeLimit(r.GetValue(timeLimit), 60)
                        ),
                        console ?? AnsiConsole.Console,
                        ct
                    )
                )
        );
        return command;
    }
}
