using System.Data.Common;
using SortRig.Storage.Contracts;
using SortRig.Storage.Postgres;
using SortRig.Storage.Sqlite;

namespace SortRig.Storage;

/// <summary>Opens a precision log on the engine named by a connection string, applying schema migrations.</summary>
public static class PrecisionLogFactory
{
    private const string Expected =
        "expected a SQLite file ('Data Source=sortrig.db' or a bare path such as /var/lib/sortrig/log.db) "
        + "or PostgreSQL ('Host=127.0.0.1;Port=5432;Database=sortrig;Username=bench')";

    /// <summary>
    /// Tells the engine from a connection string: a bare path or one with Data Source/DataSource/Filename is SQLite,
    /// one with Host/Server is PostgreSQL.
    /// </summary>
    /// <exception cref="ArgumentException">The string is empty, malformed or names neither engine.</exception>
    public static StorageEngine DetectEngine(string connectionString)
    {
        if (string.IsNullOrWhiteSpace(connectionString))
        {
            throw new ArgumentException($"Connection string is empty; {Expected}.", nameof(connectionString));
        }

        if (!connectionString.Contains('=', StringComparison.Ordinal))
        {
            return StorageEngine.Sqlite;
        }

        var builder = new DbConnectionStringBuilder();
        try
        {
            builder.ConnectionString = connectionString;
        }
        catch (ArgumentException e)
        {
            throw new ArgumentException(
                $"Connection string is malformed ({e.Message}); {Expected}.",
                nameof(connectionString),
                e
            );
        }

        if (builder.ContainsKey("Host") || builder.ContainsKey("Server"))
        {
            return StorageEngine.Postgres;
        }

        if (builder.ContainsKey("Data Source") || builder.ContainsKey("DataSource") || builder.ContainsKey("Filename"))
        {
            return StorageEngine.Sqlite;
        }

        throw new ArgumentException($"Connection string names no database; {Expected}.", nameof(connectionString));
    }

    /// <summary>
    /// Checks a connection string without opening anything: the engine is known, and a SQLite path is neither a folder
    /// nor a device. Verbs call it before they start, so a bad --db is one line and nothing is created.
    /// </summary>
    /// <exception cref="ArgumentException">The string names no engine, or a SQLite path that is a folder or a
    /// device.</exception>
    /// <exception cref="StorageException">The SQLite file's folder does not exist or cannot be written.</exception>
    public static void CheckTarget(string connectionString)
    {
        if (DetectEngine(connectionString) != StorageEngine.Sqlite)
        {
            return;
        }

        var builder = connectionString.Contains('=', StringComparison.Ordinal)
            ? new Microsoft.Data.Sqlite.SqliteConnectionStringBuilder(connectionString)
            : new Microsoft.Data.Sqlite.SqliteConnectionStringBuilder { DataSource = connectionString.Trim() };
        if (!string.IsNullOrWhiteSpace(builder.DataSource) && builder.DataSource != ":memory:")
        {
            SqlitePrecisionLog.RequireFilePath(
                builder.DataSource,
                writes: builder.Mode != Microsoft.Data.Sqlite.SqliteOpenMode.ReadOnly
            );
        }
    }

    /// <summary>Opens the log, creating or migrating its schema. Dispose it when done.</summary>
    /// <param name="connectionString">See <see cref="DetectEngine"/>.</param>
    /// <param name="options">Options; null for defaults.</param>
    /// <param name="cancellationToken">Caller cancellation.</param>
    /// <exception cref="StorageException">The store cannot be opened or migrated.</exception>
    public static async Task<IPrecisionLog> OpenAsync(
        string connectionString,
        PrecisionLogOptions? options,
        CancellationToken cancellationToken
    )
    {
        options ??= new PrecisionLogOptions();
        return DetectEngine(connectionString) switch
        {
            StorageEngine.Postgres => await PostgresPrecisionLog
                .OpenAsync(connectionString, options, null, cancellationToken)
                .ConfigureAwait(false),
            _ => await SqlitePrecisionLog
                .OpenAsync(connectionString, options, null, cancellationToken)
                .ConfigureAwait(false),
        };
    }
}
