namespace SortRig.Storage.Contracts;

/// <summary>Verdict of <see cref="IPrecisionLog.VerifyAsync"/>.</summary>
/// <param name="SchemaVersion">Schema version found in the store.</param>
/// <param name="Problems">Each problem found, in words; empty when the store is sound.</param>
public sealed record IntegrityReport(int SchemaVersion, IReadOnlyList<string> Problems)
{
    /// <summary>True when no problem was found.</summary>
    public bool IsOk => Problems.Count == 0;
}

/// <summary>The database engine behind a precision log.</summary>
public enum StorageEngine
{
    /// <summary>Embedded SQLite file (the default).</summary>
    Sqlite = 0,

    /// <summary>PostgreSQL server (shared lab library).</summary>
    Postgres = 1,
}
