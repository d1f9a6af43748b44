using SortRig.Host.LibraryVerb;
using SortRig.Planning.Recipes;
using SortRig.Storage;
using SortRig.Storage.Contracts;
using Spectre.Console;

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
        catch (Exception e)
            when (e
                    is VerbException
                        or RecipeException
                        or StorageException
                        or ArgumentException
                        or IOException
                        or UnauthorizedAccessException
            )
        {
            console.MarkupLine($"[red]error:[/] {Markup.Escape(e.Message)}");
            return VerbExit.BadInput;
        }
    }

    /// <summary>
    /// Opens the precision log named by a SQLite path or a PostgreSQL connection string. The log must exist: the
    /// verbs that read it (plan, library, report) never create one, so a misspelt --db is named instead of
    /// answered with an empty database.
    /// </summary>
    public static Task<IPrecisionLog> OpenLogAsync(string database, CancellationToken cancellationToken)
    {
        RequireExisting(database);
        return PrecisionLogFactory.OpenAsync(database, null, cancellationToken);
    }

    /// <summary>Throws <see cref="VerbException"/> when <paramref name="database"/> is a SQLite file that does not
    /// exist.</summary>
    public static void RequireExisting(string database)
    {
        if (PrecisionLogFactory.DetectEngine(database) != StorageEngine.Sqlite)
        {
            return;
        }

        var path = database;
        if (database.Contains('=', StringComparison.Ordinal))
        {
            var builder = new System.Data.Common.DbConnectionStringBuilder { ConnectionString = database };
            path =
                (
                    builder.TryGetValue("Data Source", out var a) ? a
                    : builder.TryGetValue("DataSource", out var b) ? b
                    : builder.TryGetValue("Filename", out var c) ? c
                    : null
                ) as string
                ?? "";
        }

        if (path != ":memory:" && !File.Exists(path))
        {
            throw new VerbException($"--db: no database at '{path}' (sorting creates one; check the path)");
        }
    }

    /// <summary>Default database: the sort verb's setting (SORTRIG_Sort__Database) or sortrig.db.</summary>
    public static string DefaultDatabase() =>
        Environment.GetEnvironmentVariable("SORTRIG_Sort__Database") is { Length: > 0 } db ? db : "sortrig.db";
}
