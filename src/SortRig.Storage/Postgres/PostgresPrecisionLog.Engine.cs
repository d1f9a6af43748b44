using System.Data.Common;
using System.Net.Sockets;
using Npgsql;
using SortRig.Storage.Contracts;
using SortRig.Storage.Core;

namespace SortRig.Storage.Postgres;

/// <summary>PostgreSQL specifics: SQLSTATE classification, array-based drift inserts, server-side checks.</summary>
internal sealed partial class PostgresPrecisionLog
{
    private const int DriftChunk = 5000;

    /// <summary>SQLSTATE codes from PostgreSQL 15 manual, Appendix A.</summary>
    private protected override StorageFault Classify(DbException exception, out bool transient)
    {
        var fault = ClassifyCore(exception, out transient);
        if (fault == StorageFault.Unavailable)
        {
            ForgetPooledConnections();
        }

        return fault;
    }

    internal static StorageFault ClassifyCore(DbException exception, out bool transient)
    {
        transient = false;
        if (exception is PostgresException pg)
        {
            transient = pg.SqlState is "40001" or "40P01"; // serialization_failure, deadlock_detected
            return pg.SqlState switch
            {
                "40001" or "40P01" => StorageFault.Conflict,
                "55P03" => StorageFault.Locked, // lock_not_available (lock_timeout)
                "25006" or "42501" => StorageFault.ReadOnly, // read_only_sql_transaction, insufficient_privilege
                "53100" => StorageFault.DiskFull, // disk_full
                "XX001" or "XX002" => StorageFault.Corrupt, // data_corrupted, index_corrupted
                "3D000" or "57P01" or "57P02" or "57P03" => StorageFault.Unavailable,
                _ when pg.SqlState.StartsWith("23", StringComparison.Ordinal) => StorageFault.Constraint,
                _ when pg.SqlState.StartsWith("08", StringComparison.Ordinal) => StorageFault.Unavailable,
                _ when pg.SqlState.StartsWith("28", StringComparison.Ordinal) => StorageFault.Unavailable,
                _ => StorageFault.Other,
            };
        }

        // A broken connection or a command timeout (the server or the link stopped answering), also when it comes
        // wrapped: a connection used again after it broke reports "previously broken" around the first failure.
        return exception is NpgsqlException && LinkFailure(exception.InnerException)
            ? StorageFault.Unavailable
            : StorageFault.Other;
    }

    private static bool LinkFailure(Exception? inner) =>
        inner switch
        {
            SocketException or IOException or TimeoutException => true,
            NpgsqlException wrapped => LinkFailure(wrapped.InnerException),
            _ => false,
        };

    /// <summary>INSERT ... SELECT FROM unnest(arrays) per chunk of 5000 samples: few round trips, memory bounded by the
    /// chunk.</summary>
    private protected override async Task<int> InsertDriftSamplesAsync(
        DbScope scope,
        IReadOnlyList<StoredDriftSample> samples,
        CancellationToken cancellationToken
    )
    {
        int inserted = 0;
        for (int start = 0; start < samples.Count; start += DriftChunk)
        {
            int n = Math.Min(DriftChunk, samples.Count - start);
            var runs = new long[n];
            var channels = new int[n];
            var times = new DateTimeOffset[n];
            var ohms = new double[n];
            var temps = new double?[n];
            for (int i = 0; i < n; i++)
            {
                var s = samples[start + i];
                (runs[i], channels[i], times[i], ohms[i], temps[i]) = (
                    s.RunId,
                    s.Channel,
                    ToMicroseconds(s.Time),
                    s.Ohms,
                    s.Temperature
                );
            }

            inserted += await scope
                .Sql(
                    "INSERT INTO drift_samples (run_id, channel, taken_at, ohms, temperature_c) "
                        + "SELECT * FROM unnest(@runs, @channels, @times, @ohms, @temps) ON CONFLICT DO NOTHING"
                )
                .With("runs", runs)
                .With("channels", channels)
                .With("times", times)
                .With("ohms", ohms)
                .With("temps", temps)
                .ExecuteAsync(cancellationToken)
                .ConfigureAwait(false);
        }

        return inserted;
    }

    /// <summary>The server keeps its own integrity; report checksum failures if data checksums are on.</summary>
    private protected override async Task<IReadOnlyList<string>> EngineProblemsAsync(
        DbScope scope,
        CancellationToken cancellationToken
    )
    {
        var failures = await scope
            .Sql("SELECT COALESCE(SUM(checksum_failures), 0) FROM pg_stat_database WHERE datname = current_database()")
            .ScalarLongAsync(cancellationToken)
            .ConfigureAwait(false);
        return failures > 0 ? [$"pg_stat_database reports {failures} data checksum failures."] : [];
    }
}
