using System.CommandLine;
using SortRig.Engine.Parts;
using SortRig.Host.LibraryVerb;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.Cli;

/// <summary>The library verb and its sub-verbs: find, sets, take, release, used, retire, locate, export,
/// labels.</summary>
internal static class LibraryCommand
{
    public static Command Create(IAnsiConsole? console = null, TextWriter? stdout = null)
    {
        IAnsiConsole Console() => console ?? AnsiConsole.Console;
        TextWriter Out() => stdout ?? System.Console.Out;
        var library = new Command(
            "library",
            "The calibrated part library: find parts, plan sets, take/use/retire parts, record locations, export "
                + "CSV, print labels."
        );

        var find = Sub(library, "find", "Find available parts by nominal and deviation window.", out var db);
        var nominal = Add(find, new Option<string?>("--nominal") { Description = "Nominal, e.g. 10000, 10k, 4.99k" });
        var min = Add(
            find,
            new Option<double?>("--min-ppm") { Description = "Lowest deviation from nominal, ppm (inclusive)" }
        );
        var max = Add(
            find,
            new Option<double?>("--max-ppm") { Description = "Highest deviation from nominal, ppm (inclusive)" }
        );
        var status = Add(
            find,
            new Option<string>("--status")
            {
                Description = "available (default), taken, used, retired or any",
                DefaultValueFactory = _ => "available",
            }
        );
        var at = Add(find, new Option<string?>("--location") { Description = "Only parts stored at this location" });
        var limit = Add(
            find,
            new Option<int>("--limit")
            {
                Description = "At most this many parts (1..100000, default 1000)",
                DefaultValueFactory = _ => 1000,
            }
        );
        find.SetAction(
            (r, ct) =>
                LibraryFind.RunAsync(
                    new FindRequest(
                        r.GetValue(db)!,
                        r.GetValue(nominal),
                        r.GetValue(min),
                        r.GetValue(max),
                        r.GetValue(status)!,
                        r.GetValue(at),
                        r.GetValue(limit)
                    ),
                    Console(),
                    ct
                )
        );

        var sets = Sub(
            library,
            "sets",
            "Plan the sets of a recipe from every session's available parts.",
            out var setsDb
        );
        var recipe = Add(sets, CliOptions.Recipe());
        var csv = Add(sets, new Option<string?>("--csv") { Description = "Export the pick list to this CSV file" });
        var take = Add(
            sets,
            new Option<string?>("--take", "--by")
            {
                Description = "Take the picked parts for this person (all or none); --by as in library take",
            }
        );
        var pick = Add(sets, CliOptions.Pick());
        sets.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(Console(), () =>
                    PlanRunner.RunAsync(
                        new PlanRequest(
                            r.GetValue(setsDb)!,
                            null,
                            r.GetValue(recipe)!,
                            r.GetValue(csv),
                            r.GetValue(take),
                            CliOptions.ParsePick(r.GetValue(pick))
                        ),
                        Console(),
                        ct
                    )
                )
        );

        Move(
            library,
            "take",
            "Take parts for a build (all or none).",
            LibraryMove.Take,
            new Option<string>("--by") { Description = "Who takes them", Required = true },
            Console
        );
        Move(library, "release", "Give taken parts back (all or none).", LibraryMove.Release, null, Console);
        Move(
            library,
            "used",
            "Mark taken parts as fitted into a build (all or none).",
            LibraryMove.Use,
            new Option<string>("--build") { Description = "The build they went into" },
            Console
        );
        Move(
            library,
            "retire",
            "Retire parts: damaged, drifted, lost (all or none).",
            LibraryMove.Retire,
            new Option<string>("--reason") { Description = "Why", Required = true },
            Console
        );

        var locate = Sub(library, "locate", "Record where a part is stored.", out var locateDb);
        var id = Add(locate, new Option<long>("--id") { Description = "Part id", Required = true });
        var where = Add(
            locate,
            new Option<string?>("--at") { Description = "Location, e.g. \"bag 7\"; omit to clear" }
        );
        locate.SetAction(
            (r, ct) => LibraryLocate.RunAsync(r.GetValue(locateDb)!, r.GetValue(id), r.GetValue(where), Console(), ct)
        );

        var export = Sub(library, "export", "Export the library (every live part) as CSV.", out var exportDb);
        var file = Add(
            export,
            new Option<string>("--csv") { Description = "CSV file, or - for standard output", Required = true }
        );
        var exportStatus = Add(
            export,
            new Option<string>("--status")
            {
                Description = "any (default), available, taken, used or retired",
                DefaultValueFactory = _ => "any",
            }
        );
        var exportNominal = Add(
            export,
            new Option<string?>("--nominal") { Description = "Only this nominal, e.g. 10k" }
        );
        export.SetAction(
            (r, ct) =>
                LibraryExport.RunAsync(
                    r.GetValue(exportDb)!,
                    r.GetValue(file)!,
                    r.GetValue(exportStatus),
                    r.GetValue(exportNominal),
                    Console(),
                    Out(),
                    ct
                )
        );

        var labels = Sub(
            library,
            "labels",
            "Print plain labels (fixed-width text, or CSV for label software).",
            out var labelsDb
        );
        var labelIds = Add(labels, CliOptions.Ids());
        var format = Add(
            labels,
            new Option<string>("--format") { Description = "text (default) or csv", DefaultValueFactory = _ => "text" }
        );
        var output = Add(
            labels,
            new Option<string?>("--out") { Description = "Write to this file instead of standard output" }
        );
        labels.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(Console(), () =>
                    LibraryLabels.RunAsync(
                        r.GetValue(labelsDb)!,
                        PartIds.Parse(r.GetValue(labelIds)),
                        r.GetValue(format),
                        r.GetValue(output),
                        Console(),
                        Out(),
                        ct
                    )
                )
        );
        return library;
    }

    private static void Move(
        Command library,
        string name,
        string description,
        LibraryMove move,
        Option<string>? note,
        Func<IAnsiConsole> console
    )
    {
        var command = Sub(library, name, description, out var db);
        var ids = Add(command, CliOptions.Ids());
        if (note is not null)
        {
            command.Add(note);
        }

        command.SetAction(
            (r, ct) =>
                VerbGuard.RunAsync(console(), () =>
                    LibraryMoves.RunAsync(
                        new MoveRequest(
                            r.GetValue(db)!,
                            move,
                            PartIds.Parse(r.GetValue(ids)),
                            note is null ? null : r.GetValue(note)
                        ),
                        console(),
                        ct
                    )
                )
        );
    }

    private static Command Sub(Command parent, string name, string description, out Option<string> db)
    {
        var command = new Command(name, description);
        db = Add(command, CliOptions.Database());
        parent.Add(command);
        return command;
    }

    private static Option<T> Add<T>(Command command, Option<T> option)
    {
        command.Add(option);
        return option;
    }
}
