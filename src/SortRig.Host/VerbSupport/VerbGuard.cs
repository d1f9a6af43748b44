using Spectre.Console;
using SortRig.Host.LibraryVerb;
using SortRig.Planning.Recipes;
using SortRig.Storage;
using SortRig.Storage.Contracts;

namespace SortRig.Host.VerbSupport;

/// <summary>Runs a verb body, turning the errors a user can cause into one red line and exit code 2.</summary>
internal static class VerbGuard
{
    public static async Task<int> RunAsync(IAnsiConsole console, Func<Task<int>> body)
    {
        try
        {
            return await body().ConfigureAwait(false);
        }
        catch (Exception e) when (e is VerbException or RecipeException or StorageException or ArgumentException
                                      or IOException or UnauthorizedAccessException)
        {
            console.MarkupLine($"[red]error:[/] {Markup.Escape(e.Message)}");
            return VerbExit.BadInput;
        }
    }

    /// <summary>Opens the precision log named by a SQLite path or a PostgreSQL connection string.</summary>
    public static Task<IPrecisionLog> OpenLogAsync(string database, CancellationToken cancellationToken) =>
        PrecisionLogFactory.OpenAsync(database, null, cancellationToken);

    /// <summary>Default database: the sort verb's setting (SORTRIG_Sort__Database) or sortrig.db.</summary>
    public static string DefaultDatabase() =>
        Environment.GetEnvironmentVariable("SORTRIG_Sort__Database") is { Length: > 0 } db ? db : "sortrig.db";
}
