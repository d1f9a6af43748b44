using SortRig.Host.VerbSupport;
using Spectre.Console;

namespace SortRig.Host.LibraryVerb;

/// <summary>The locate verb: records where a part is stored ("bag 7", "drawer 3 box B"), or clears it.</summary>
internal static class LibraryLocate
{
    /// <param name="database">SQLite path or PostgreSQL connection string.</param>
    /// <param name="id">Part id.</param>
    /// <param name="at">New location (1..200 characters), or null to clear.</param>
    /// <param name="console">Where messages go.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    public static Task<int> RunAsync(
        string database,
        long id,
        string? at,
        IAnsiConsole console,
        CancellationToken cancellationToken
    ) => VerbGuard.RunAsync(console, async () =>
        {
            TextArg.Check(at, "--at");
            var location = string.IsNullOrWhiteSpace(at) ? null : at.Trim();
            if (location is { Length: > 200 })
            {
                throw new VerbException("--at: at most 200 characters");
            }

            await using var log = await VerbGuard.OpenLogAsync(database, cancellationToken).ConfigureAwait(false);
            if (await log.GetPartAsync(id, cancellationToken).ConfigureAwait(false) is not { } before)
            {
                throw new VerbException($"unknown part id: {id} (nothing changed)");
            }

            var after = await log.SetLocationAsync(id, location, cancellationToken).ConfigureAwait(false);
            console.MarkupLine(
                Markup.Escape(
                    $"part {id}: {(before.Location is { } b ? "'" + b + "'" : "no location")} -> "
                        + $"{(after.Location is { } a ? "'" + a + "'" : "no location")}"
                )
            );
            return VerbExit.Ok;
        });
}
