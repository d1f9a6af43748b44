using System.CommandLine;
using Spectre.Console;
using SortRig.Host.Library;
using SortRig.Host.Planning;

namespace SortRig.Host.Cli;

/// <summary>The plan verb: reads a saved session and a recipe, prints the pick list per set and exports it as CSV.</summary>
internal static class PlanCommand
{
    public static Command Create(IAnsiConsole? console = null)
    {
        var command = new Command("plan", "Plan the sets of a recipe from a saved session: print the pick list (parts or cups, outputs, errors) and export it as CSV.");
        var db = CliOptions.Database();
        var session = new Option<string>("--session") { Description = "Session name (newest with that name) or id", Required = true };
        var recipe = CliOptions.Recipe();
        var csv = new Option<string?>("--csv") { Description = "Export the pick list to this CSV file" };
        var take = new Option<string?>("--take") { Description = "Take the picked parts from the library for this person (all or none)" };
        var pick = CliOptions.Pick();
        var timeLimit = new Option<double?>("--time-limit") { Description = "Seconds the set search may run on a large reel (default 10, 0.1 to 3600); the best plan so far is returned with its bound" };
        foreach (var o in new Option[] { db, session, recipe, csv, take, pick, timeLimit })
        {
            command.Add(o);
        }

        command.SetAction((r, ct) => VerbGuard.RunAsync(console ?? AnsiConsole.Console, () => PlanRunner.RunAsync(
            new PlanRequest(r.GetValue(db)!, r.GetValue(session)!, r.GetValue(recipe)!, r.GetValue(csv), r.GetValue(take), CliOptions.ParsePick(r.GetValue(pick)), TimeLimit(r.GetValue(timeLimit))),
            console ?? AnsiConsole.Console, ct)));
        return command;
    }

    private static TimeSpan? TimeLimit(double? seconds) => seconds switch
    {
        null => null,
        >= 0.1 and <= 3600 => TimeSpan.FromSeconds(seconds.Value),
        _ => throw new VerbException(FormattableString.Invariant($"--time-limit: {seconds} s is outside 0.1 to 3600 s")),
    };
}

/// <summary>Options shared by the plan and library verbs.</summary>
internal static class CliOptions
{
    public static Option<string> Database() => new("--db")
    {
        Description = "SQLite file or PostgreSQL connection string (\"Host=...;Database=...\"); default SORTRIG_Sort__Database or sortrig.db",
        DefaultValueFactory = _ => VerbGuard.DefaultDatabase(),
    };

    public static Option<string> Recipe() => new("--recipe") { Description = "Recipe file, or a name under recipes/ (e.g. matched-quad)", Required = true };

    public static Option<string> Pick() => new("--pick")
    {
        Description = "auto (default): by cup when every part sits in a cup and the recipe is matched; parts: by id; cups: by cup and count",
        DefaultValueFactory = _ => "auto",
    };

    public static Option<string> Ids() => new("--ids") { Description = "Part ids, e.g. 3,4,9 or 12-15", Required = true };

    public static PickMode ParsePick(string? text) => (text ?? "auto").Trim().ToLowerInvariant() switch
    {
        "auto" => PickMode.Auto,
        "parts" or "part" => PickMode.Parts,
        "cups" or "cup" => PickMode.Cups,
        _ => throw new VerbException($"--pick: '{text}' is not auto, parts or cups"),
    };
}
