using System.Data.Common;
using Microsoft.Data.Sqlite;
using SortRig.Storage.Contracts;
using SortRig.Storage.Core;

namespace SortRig.Storage.Sqlite;

/// <summary>SQLite specifics: fault codes, drift inserts, integrity check, schema version lookup.</summary>
internal sealed partial class SqlitePrecisionLog
{
    /// <summary>Primary result codes from https://sqlite.org/rescode.html.</summary>
    private protected override StorageFault Classify(DbException exception, out bool transient)
    {
        transient = false;
        return exception is not SqliteException e
            ? StorageFault.Other
            : e.SqliteErrorCode switch
            {
                5 or 6 => StorageFault.Locked, // SQLITE_BUSY, SQLITE_LOCKED
                8 or 3 => StorageFault.ReadOnly, // SQLITE_READONLY, SQLITE_PERM
                13 => StorageFault.DiskFull, // SQLITE_FULL
                11 or 26 => StorageFault.Corrupt, // SQLITE_CORRUPT, SQLITE_NOTADB
                14 => StorageFault.Unavailable, // SQLITE_CANTOPEN
                19 => StorageFault.Constraint, // SQLITE_CONSTRAINT
                _ => StorageFault.Other,
            };
    }

    /// <summary>One prepared INSERT reused for every sample, all inside the caller's transaction.</summary>
    private protected override async Task<int> InsertDriftSamplesAsync(
        DbScope scope,
        IReadOnlyList<StoredDriftSample> samples,
        CancellationToken cancellationToken
    )
    {
        var q = scope
            .Sql(
                "INSERT INTO drift_samples (run_id, channel, taken_at, ohms, temperature_c) VALUES (@run, @channel, "
                    + "@at, @ohms, @temp) "
                    + "ON CONFLICT DO NOTHING"
            )
            .With("run", 0L)
            .With("channel", 0)
            .With("at", 0L)
            .With("ohms", 0.0)
            .With("temp", null);
        int inserted = 0;
        await using (q.Command.ConfigureAwait(false))
        {
            var ps = q.Command.Parameters;
            foreach (var sample in samples)
            {
                ps[0].Value = sample.RunId;
                ps[1].Value = sample.Channel;
                ps[2].Value = TimeValue(sample.Time);
                ps[3].Value = sample.Ohms;
                ps[4].Value = sample.Temperature is { } t ? t : DBNull.Value;
                inserted += await q.Command.ExecuteNonQueryAsync(cancellationToken).ConfigureAwait(false);
            }
        }

        return inserted;
    }

    /// <summary>PRAGMA integrity_check and foreign_key_check (https://sqlite.org/pragma.html).</summary>
    private protected override async Task<IReadOnlyList<string>> EngineProblemsAsync(
        DbScope scope,
        CancellationToken cancellationToken
    )
    {
        var integrity = await scope
            .Sql("PRAGMA integrity_check")
            .ListAsync(r => r.GetString(0), cancellationToken)
            .ConfigureAwait(false);
        var problems =
            integrity.Count == 1 && integrity[0] == "ok" ? [] : integrity.Select(p => "integrity_check: " + p).ToList();
        var keys = await scope
            .Sql("PRAGMA foreign_key_check")
            .ListAsync(
                r => $"foreign_key_check: {r.GetString(0)} row {r.GetValue(1)} points to a missing {r.GetString(2)}",
                cancellationToken
            )
            .ConfigureAwait(false);
        problems.AddRange(keys);
        return problems;
    }

    private protected override async Task<bool> SchemaVersionExistsAsync(
        DbScope scope,
        CancellationToken cancellationToken
    ) =>
        await scope
            .Sql("SELECT COUNT(*) FROM sqlite_master WHERE type = 'table' AND name = 'schema_version'")
            .ScalarLongAsync(cancellationToken)
            .ConfigureAwait(false) > 0;
}
