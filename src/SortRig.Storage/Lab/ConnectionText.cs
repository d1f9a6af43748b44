using System.Data.Common;

namespace SortRig.Storage.Lab;

/// <summary>
/// Connection strings as they may be shown: with any password masked. A password belongs in the environment
/// (PGPASSWORD, or the whole string in SORTRIG_Sort__Database), a passfile (Passfile=/path, ~/.pgpass) or a config
/// file, never on a command line (every user of the machine can read the process list) and never in a log.
/// </summary>
public static class ConnectionText
{
    private static readonly string[] s_secretKeys = ["Password", "Pwd", "SSL Password", "SslPassword"];

    /// <summary>True when the string carries a password (Password=, Pwd=, SSL Password=).</summary>
    public static bool HasPassword(string? connectionString) =>
        TryParse(connectionString, out var builder)
        && s_secretKeys.Any(k => builder.ContainsKey(k) && !string.IsNullOrEmpty(builder[k]?.ToString()));

    /// <summary>
    /// The string with every password value replaced by ***; a bare file path unchanged; a string that does not
    /// parse is not shown at all (it might hold a password we could not find).
    /// </summary>
    public static string Mask(string? connectionString)
    {
        if (string.IsNullOrEmpty(connectionString) || !connectionString.Contains('=', StringComparison.Ordinal))
        {
            return connectionString ?? string.Empty;
        }

        if (!TryParse(connectionString, out var builder))
        {
            return "(connection string not shown: it does not parse)";
        }

        foreach (var key in s_secretKeys.Where(builder.ContainsKey))
        {
            builder[key] = "***";
        }

        return builder.ConnectionString;
    }

    private static bool TryParse(string? connectionString, out DbConnectionStringBuilder builder)
    {
        builder = new DbConnectionStringBuilder();
        if (string.IsNullOrEmpty(connectionString) || !connectionString.Contains('=', StringComparison.Ordinal))
        {
            return false;
        }

        try
        {
            builder.ConnectionString = connectionString;
            return true;
        }
        catch (ArgumentException)
        {
            return false;
        }
    }
}
