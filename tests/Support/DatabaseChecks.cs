using Microsoft.Data.Sqlite;

namespace SortRig.Tests.Support;

/// <summary>Checks on a precision-log SQLite file made through a connection of its own (read-only, unpooled).</summary>
internal static class DatabaseChecks
{
    /// <summary>SQLite's own structural check (sqlite.org "PRAGMA integrity_check") answers "ok".</summary>
    public static void AssertIntegrity(string db)
    {
        using var c = Open(db);
        using var check = c.CreateCommand();
        check.CommandText = "PRAGMA integrity_check";
        Assert.Equal("ok", check.ExecuteScalar() as string);
    }

    /// <summary>Opens the file read-only on a connection that is not pooled.</summary>
    public static SqliteConnection Open(string db)
    {
        var c = new SqliteConnection($"Data Source={db};Mode=ReadOnly;Pooling=False");
        c.Open();
        return c;
    }
}
