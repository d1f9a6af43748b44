using SortRig.Host.VerbSupport;
using SortRig.Measurement.Readings;
using SortRig.Storage.Contracts;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>The take, release, used and retire verbs: one all-or-none change through <see
/// cref="IPrecisionLog"/>.</summary>
internal static class LibraryMoves
{
    public static Task<int> RunAsync(MoveRequest request, IAnsiConsole console, CancellationToken cancellationToken) =>
        VerbGuard.RunAsync(console, async () =>
        {
            if (request.Move is LibraryMove.Take or LibraryMove.Retire && string.IsNullOrWhiteSpace(request.Note))
            {
                throw new VerbException(
                    request.Move == LibraryMove.Take
                        ? "--by: say who takes the parts"
                        : "--reason: say why the parts are retired"
                );
            }

            TextArg.Check(
                request.Note,
                request.Move switch
                {
                    LibraryMove.Take => "--by",
                    LibraryMove.Retire => "--reason",
                    _ => "--build",
                }
            );
            await using var log = await VerbGuard
                .OpenLogAsync(request.Database, cancellationToken)
                .ConfigureAwait(false);
            var unknown = await Refusals.UnknownAsync(log, request.Ids, cancellationToken).ConfigureAwait(false);
            if (unknown.Count > 0)
            {
                throw new VerbException($"unknown part ids: {string.Join(", ", unknown)} (nothing changed)");
            }

            var result = request.Move switch
            {
                LibraryMove.Take => await log.TakePartsAsync(request.Ids, request.Note!, cancellationToken)
                    .ConfigureAwait(false),
                LibraryMove.Release => await log.ReleasePartsAsync(request.Ids, cancellationToken)
                    .ConfigureAwait(false),
                LibraryMove.Use => await log.MarkUsedAsync(request.Ids, request.Note, cancellationToken)
                    .ConfigureAwait(false),
                _ => await log.RetireAsync(request.Ids, request.Note!, cancellationToken).ConfigureAwait(false),
            };
            return await ReportAsync(log, request.Move, result, console, cancellationToken).ConfigureAwait(false);
        });

    /// <summary>Prints the verdict of a change; a refusal names each refused id and why. Returns the exit
    /// code.</summary>
    public static async Task<int> ReportAsync(
        IPrecisionLog log,
        LibraryMove move,
        LibraryResult result,
        IAnsiConsole console,
        CancellationToken cancellationToken
    )
    {
        var verb = Verb(move);
        if (!result.Succeeded)
        {
            var why = await Refusals
                .DescribeAsync(log, result.Refused, result.Holders, cancellationToken)
                .ConfigureAwait(false);
            console.MarkupLine(
                $"[red]{verb} refused, nothing changed.[/] {Markup.Escape(Needs(move))}; not so for {why.Count} "
                    + $"part(s):"
            );
            foreach (var line in why)
            {
                console.MarkupLine("  " + Markup.Escape(line));
            }

            return VerbExit.Refused;
        }

        var table = new Table().Border(TableBorder.Simple);
        foreach (var c in new[] { "id", "nominal", "value (Ohm)", "status", "taken by" })
        {
            table.AddColumn(c);
        }

        foreach (var p in result.Changed)
        {
            table.AddRow(
                p.Id.ToString(Invariant),
                Markup.Escape(OhmsText.Nominal(p.Nominal)),
                Format.Value(p.Value),
                p.LibraryStatus.ToString(),
                Markup.Escape(p.TakenBy ?? "")
            );
        }

        console.Write(table);
        console.MarkupLine($"[green]{verb}: {result.Changed.Count} part(s).[/]");
        return VerbExit.Ok;
    }

    private static IFormatProvider Invariant => System.Globalization.CultureInfo.InvariantCulture;

    private static string Verb(LibraryMove move) =>
        move switch
        {
            LibraryMove.Take => "take",
            LibraryMove.Release => "release",
            LibraryMove.Use => "used",
            _ => "retire",
        };

    private static string Needs(LibraryMove move) =>
        move switch
        {
            LibraryMove.Take => "every part must be Available and live",
            LibraryMove.Release => "every part must be Taken",
            LibraryMove.Use => "every part must be Taken first (library take)",
            _ => "no part may be Retired already",
        };
}
