using System.Globalization;
using SortRig.Engine.Picking;
using SortRig.Host.PlanVerb;
using SortRig.Host.VerbSupport;
using SortRig.Planning.Assembly;
using SortRig.Planning.Ordering;
using SortRig.Planning.Reach;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;
using Spectre.Console;
using static System.FormattableString;

namespace SortRig.Host.OrderVerb;

/// <summary>Loads the parts on hand (read-only), finds the tightest match for N sets and the extra part that adds
/// one.</summary>
internal static class ReachRunner
{
    public static Task<int> RunAsync(ReachRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            if (request.Sets < 1)
            {
                throw new VerbException($"--sets: {request.Sets} sets is nothing to reach for (give 1 to 10 000)");
            }

            var recipe = await RecipeLoader
                .LoadFileAsync(PlanRunner.RecipePath(request.Recipe), cancellationToken)
                .ConfigureAwait(false);
            await using var log = await VerbGuard
                .OpenLogAsync(request.Database, cancellationToken)
                .ConfigureAwait(false);
            IReadOnlyList<PartRecord> records;
            string title;
            if (request.Session is { } name)
            {
                var session = await SessionLookup
                    .FindAsync(log, name, cancellationToken, t => console.MarkupLine($"[yellow]{Markup.Escape(t)}[/]"))
                    .ConfigureAwait(false);
                records = await log.GetPartsAsync(session.Id, cancellationToken).ConfigureAwait(false);
                title = $"session '{session.Name}' (id {session.Id})";
            }
            else
            {
                records = await log.FindPartsAsync(
                        new LibraryQuery(Status: LibraryStatus.Available, Limit: PlanRunner.LibraryLimit),
                        cancellationToken
                    )
                    .ConfigureAwait(false);
                title = "the library's available parts";
            }

            var options = request.TimeLimit is { } limit
                ? new AssemblyOptions(timeLimit: limit)
                : OrderOptions.FastAssembly;
            var parts = records
                .Where(p => PlanParts.Offered(p, recipe, options))
                .Select(p => PlanParts.Candidate(p, qualify: false))
                .ToList();
            var reach = await Task.Run(
                    () =>
                        new OnHandReach(options).Find(
                            recipe,
                            parts,
                            request.Sets,
                            cancellationToken: cancellationToken
                        ),
                    cancellationToken
                )
                .ConfigureAwait(false);
            Write(console, reach, title, recipe);
            return VerbExit.Ok;
        });

    private static void Write(IAnsiConsole console, ReachResult r, string title, Recipe recipe)
    {
        var tightest = r.MatchPpm is { } ppm
            ? string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"match {ppm:0.#} ppm (recipe {recipe.MatchTolerancePpm:0.#} ppm; at "
                    + $"{recipe.MatchTolerancePpm * r.TighterScale:0.#} ppm only {r.SetsAtTighter} set(s))"
            )
            : Invariant(
                $"every output tolerance × {r.Scale:0.###} (at × {r.TighterScale:0.###} only {r.SetsAtTighter} set(s))"
            );
        console.MarkupLine(
            Markup.Escape(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"Reach of {r.Parts} part(s) from {title} for {r.SetsWanted} set(s) of {r.RecipeName}: "
                        + $"{r.SetsAsWritten} set(s) as written."
                )
            )
        );
        console.MarkupLine(
            Markup.Escape(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"tightest for {r.SetsWanted} set(s): {tightest}; {r.SetsAtScale} set(s) there; {r.Assemblies} "
                        + $"assembler runs"
                )
            )
        );
        if (r.ExtraParts.Count == 0)
        {
            console.MarkupLine(
                "no single extra part makes one more set from the leftovers: they lack more than one part"
            );
            return;
        }

        var table = new Table()
            .Border(TableBorder.Rounded)
            .Title("one extra part that makes one more set (recipe as written, sets kept)");
        foreach (
            var c in new[]
            {
                "nominal",
                "from (ohm)",
                "to (ohm)",
                "from (ppm)",
                "to (ppm)",
                "uncertainty assumed (ppm)",
            }
        )
        {
            table.AddColumn(new TableColumn(c).RightAligned());
        }

        foreach (var x in r.ExtraParts)
        {
            table.AddRow(
                OrderView.Ohms(x.Nominal),
                Format.Value(x.LowOhms),
                Format.Value(x.HighOhms),
                Format.Ppm(x.LowPpm),
                Format.Ppm(x.HighPpm),
                Invariant($"{x.ExpandedUncertaintyOhms / x.Nominal * 1e6:0.#}")
            );
        }

        console.Write(table);
    }
}
