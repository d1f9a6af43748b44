using SortRig.Engine.Picking;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Assembly;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.PlanVerb;

/// <summary>Loads the recipe and the parts, plans, prints, exports and optionally takes the picked parts.</summary>
internal static class PlanRunner
{
    /// <summary>Most parts read from the library for one plan.</summary>
    public const int LibraryLimit = 100_000;

    public static Task<int> RunAsync(PlanRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            var recipe = await RecipeLoader
                .LoadFileAsync(RecipePath(request.Recipe), cancellationToken)
                .ConfigureAwait(false);
            await using var log = await VerbGuard
                .OpenLogAsync(request.Database, cancellationToken)
                .ConfigureAwait(false);
            IReadOnlyList<PartRecord> parts;
            string title;
            if (request.Session is { } name)
            {
                var session = await SessionLookup
                    .FindAsync(log, name, cancellationToken, t => console.MarkupLine($"[yellow]{Markup.Escape(t)}[/]"))
                    .ConfigureAwait(false);
                parts = await log.GetPartsAsync(session.Id, cancellationToken).ConfigureAwait(false);
                title = $"session '{session.Name}' (id {session.Id})";
            }
            else
            {
                parts = await log.FindPartsAsync(
                        new LibraryQuery(Status: LibraryStatus.Available, Limit: LibraryLimit),
                        cancellationToken
                    )
                    .ConfigureAwait(false);
                title =
                    $"the library's available parts ({parts.Select(p => p.SessionId).Distinct().Count()} session(s))";
                if (parts.Count == LibraryLimit)
                {
                    console.MarkupLine($"[yellow]only the first {LibraryLimit} available parts are planned[/]");
                }
            }

            var options = new AssemblyOptions(timeLimit: request.TimeLimit, progress: new SearchProgress(console));
            var qualify = parts.Select(p => p.SessionId).Distinct().Count() > 1;
            var outcome = PickPlanner.Plan(recipe, parts, request.Mode, qualify, new SetAssembler(options), options);
            PickListView.Write(console, outcome, title);
            if (request.CsvPath is { } csv)
            {
                await using (var file = new StreamWriter(csv, append: false))
                {
                    PickListCsv.Write(file, outcome.List);
                }

                console.MarkupLine(Markup.Escape($"pick list written to {csv}"));
            }

            if (request.TakeBy is not { } by || outcome.PickedIds.Count == 0)
            {
                return VerbExit.Ok;
            }

            var taken = await log.TakePartsAsync(outcome.PickedIds, by, cancellationToken).ConfigureAwait(false);
            return await LibraryMoves
                .ReportAsync(log, LibraryMove.Take, taken, console, cancellationToken)
                .ConfigureAwait(false);
        });

    /// <summary>
    /// The path as given when it exists; else recipes/NAME.yaml (or recipes/NAME) in the working directory or any
    /// folder above it or above the program (so a name works anywhere inside a checkout, also under dotnet run).
    /// </summary>
    public static string RecipePath(string recipe)
    {
        if (File.Exists(recipe))
        {
            return recipe;
        }

        var relative = Path.Combine("recipes", Path.HasExtension(recipe) ? recipe : recipe + ".yaml");
        foreach (var start in new[] { Environment.CurrentDirectory, AppContext.BaseDirectory })
        {
            for (var dir = new DirectoryInfo(start); dir is not null; dir = dir.Parent)
            {
                var candidate = Path.Combine(dir.FullName, relative);
                if (File.Exists(candidate))
                {
                    return candidate;
                }
            }
        }

        throw new VerbException(
            $"--recipe: no file '{recipe}' (also looked for {relative} here and in the folders above)"
        );
    }
}
