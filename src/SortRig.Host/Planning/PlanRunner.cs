using Spectre.Console;
using SortRig.Host.Library;
using SortRig.Planning.Assembly;
using SortRig.Planning.PickLists;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Host.Planning;

/// <summary>A plan request (the plan verb, and library sets when <paramref name="Session"/> is null).</summary>
/// <param name="Database">SQLite path or PostgreSQL connection string.</param>
/// <param name="Session">Session name or id; null for every session's available parts.</param>
/// <param name="Recipe">Recipe file, or a name under recipes/ ("matched-quad").</param>
/// <param name="CsvPath">Where to export the pick list as CSV; null for none.</param>
/// <param name="TakeBy">When set, take the picked parts from the library for this person (all or none).</param>
/// <param name="Mode">How the pick list names parts.</param>
/// <param name="TimeLimit">Search time for large reels; null for the assembler's default (10 s).</param>
internal sealed record PlanRequest(string Database, string? Session, string Recipe, string? CsvPath = null, string? TakeBy = null, PickMode Mode = PickMode.Auto, TimeSpan? TimeLimit = null);

/// <summary>Loads the recipe and the parts, plans, prints, exports and optionally takes the picked parts.</summary>
internal static class PlanRunner
{
    /// <summary>Most parts read from the library for one plan.</summary>
    public const int LibraryLimit = 100_000;

    public static Task<int> RunAsync(PlanRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            var recipe = await RecipeLoader.LoadFileAsync(RecipePath(request.Recipe), cancellationToken).ConfigureAwait(false);
            await using var log = await VerbGuard.OpenLogAsync(request.Database, cancellationToken).ConfigureAwait(false);
            IReadOnlyList<PartRecord> parts;
            string title;
            if (request.Session is { } name)
            {
                var session = await SessionLookup.FindAsync(log, name, cancellationToken).ConfigureAwait(false);
                parts = await log.GetPartsAsync(session.Id, cancellationToken).ConfigureAwait(false);
                title = $"session '{session.Name}' (id {session.Id})";
            }
            else
            {
                parts = await log.FindPartsAsync(new LibraryQuery(Status: LibraryStatus.Available, Limit: LibraryLimit), cancellationToken).ConfigureAwait(false);
                title = $"the library's available parts ({parts.Select(p => p.SessionId).Distinct().Count()} session(s))";
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
            return await LibraryMoves.ReportAsync(log, LibraryMove.Take, taken, console, cancellationToken).ConfigureAwait(false);
        });

    /// <summary>
    /// The path as given when it exists; else recipes/NAME.yaml (or recipes/NAME) in the working directory or any folder
    /// above it or above the program (so a name works anywhere inside a checkout, also under dotnet run).
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

        throw new VerbException($"--recipe: no file '{recipe}' (also looked for {relative} here and in the folders above)");
    }
}
