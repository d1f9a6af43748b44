using System.Data.Common;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Committing parts with their readings, announcing them, reading them back.</summary>
internal abstract partial class AdoPrecisionLog
{
    public async Task<PartRecord> CommitPartAsync(PartCommit commit, CancellationToken cancellationToken)
    {
        PartCommitRules.Check(commit);
        const string operation = "commit part";
        return await WriteAsync(operation, async (s, ct) =>
        {
            // A retried commit (after a crash or timeout) finds its first attempt and writes nothing.
            if (await FindByKeyAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } earlier)
            {
                return Duplicate(s, earlier);
            }

            // Allocating the number locks the session row (PostgreSQL) inside the write transaction; a rolled-back
            // commit gives its number back, so numbers stay contiguous.
            var number = await s.Sql(
                    "UPDATE sessions SET next_part_number = next_part_number + 1 WHERE id = @id AND finished_at IS NULL " +
                    "RETURNING next_part_number - 1")
                .With("id", commit.SessionId).ScalarLongAsync(ct).ConfigureAwait(false);
            if (number is null)
            {
                var session = await GetSessionCoreAsync(s, commit.SessionId, ct).ConfigureAwait(false);
                throw session is null
                    ? NotFound(operation, $"Session {commit.SessionId}")
                    : Conflict(operation, $"session {commit.SessionId} '{session.Name}' is finished; no parts can be added.");
            }

            // Under PostgreSQL READ COMMITTED a concurrent retry with the same key may have committed while we waited
            // for the session row; this statement sees it.
            if (await FindByKeyAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } raced)
            {
                return Duplicate(s, raced);
            }

            var batch = await GetBatchCoreAsync(s, commit.BatchId, ct).ConfigureAwait(false);
            if (batch is null || batch.SessionId != commit.SessionId)
            {
                throw NotFound(operation, $"Batch {commit.BatchId} of session {commit.SessionId}");
            }

            long partId = await InsertPartAsync(s, commit, (int)number.Value, batch.Setup.Nominal, ct).ConfigureAwait(false);
            await InsertReadingsAsync(s, partId, commit, ct).ConfigureAwait(false);
            return (await GetPartCoreAsync(s, partId, ct).ConfigureAwait(false))!;
        }, cancellationToken).ConfigureAwait(false);
    }

    public Task<PartRecord> MarkAnnouncedAsync(long partId, CancellationToken cancellationToken)
    {
        Guard.Id(partId, nameof(partId));
        const string operation = "mark part announced";
        return WriteAsync(operation, async (s, ct) =>
        {
            await s.Sql(
                    "UPDATE parts SET announced = @yes, state = CASE WHEN state = 'Accepted' THEN 'Announced' ELSE state END " +
                    "WHERE id = @id")
                .With("yes", true).With("id", partId).ExecuteAsync(ct).ConfigureAwait(false);
            return await GetPartCoreAsync(s, partId, ct).ConfigureAwait(false) ?? throw NotFound(operation, $"Part {partId}");
        }, cancellationToken);
    }

    public Task<IReadOnlyList<PartRecord>> GetPartsAsync(long sessionId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<PartRecord>>("read parts", async (s, ct) =>
            await s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.session_id = @id ORDER BY p.part_number")
                .With("id", sessionId).ListAsync(ReadPart, ct).ConfigureAwait(false), cancellationToken);

    public Task<PartRecord?> GetPartAsync(long partId, CancellationToken cancellationToken) =>
        ReadAsync("read part", (s, ct) => GetPartCoreAsync(s, partId, ct), cancellationToken);

    public Task<IReadOnlyList<RawReading>> GetReadingsAsync(long partId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RawReading>>("read raw readings", async (s, ct) =>
            await s.Sql("SELECT part_id, seq, taken_at, value_ohms, range_ohms, kind FROM raw_readings WHERE part_id = @id ORDER BY seq")
                .With("id", partId).ListAsync(ReadRawReading, ct).ConfigureAwait(false), cancellationToken);

    private PartRecord Duplicate(DbScope s, PartRecord earlier)
    {
        s.RollbackOnly = true;
        Log.DuplicateCommit(Logger, earlier.CommitKey, earlier.Id);
        return earlier;
    }

    private Task<PartRecord?> FindByKeyAsync(DbScope s, Guid key, CancellationToken ct) =>
        s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.commit_key = @key")
            .With("key", GuidValue(key)).FirstOrDefaultAsync(ReadPart, ct);

    private async Task<long> InsertPartAsync(DbScope s, PartCommit c, int number, double nominal, CancellationToken ct)
    {
        var m = c.Measured;
        var id = await s.Sql(
                "INSERT INTO parts (commit_key, session_id, batch_id, part_number, nominal_ohms, value_ohms, deviation_ppm, " +
                "u_standard_ohms, u_transfer_ohms, coverage_k, range_ohms, nplc, temperature_c, accepted_at, cup_label, " +
                "slot_label, state, announced, library_status) VALUES (@key, @session, @batch, @number, @nominal, @value, " +
                "@deviation, @u, @ut, @k, @range, @nplc, @temp, @at, @cup, @slot, @state, @no, 'Available') RETURNING id")
            .With("key", GuidValue(c.CommitKey)).With("session", c.SessionId).With("batch", c.BatchId).With("number", number)
            .With("nominal", nominal).With("value", m.Value).With("deviation", (m.Value - nominal) / nominal * 1e6)
            .With("u", m.StandardUncertainty).With("ut", m.TransferUncertainty).With("k", m.CoverageFactor)
            .With("range", c.Range).With("nplc", c.Nplc).With("temp", c.Temperature).With("at", TimeValue(c.AcceptedAt))
            .With("cup", c.CupLabel).With("slot", c.SlotLabel).With("state", c.State.ToString()).With("no", false)
            .ScalarLongAsync(ct).ConfigureAwait(false);
        return id!.Value;
    }

    /// <summary>One prepared INSERT reused for every reading of the part, inside the commit's transaction.</summary>
    private async Task InsertReadingsAsync(DbScope s, long partId, PartCommit c, CancellationToken ct)
    {
        if (c.Readings.Count == 0)
        {
            return;
        }

        var q = s.Sql("INSERT INTO raw_readings (part_id, seq, taken_at, value_ohms, range_ohms, kind) VALUES (@p, @q, @t, @v, @r, @k)")
            .With("p", partId).With("q", 0).With("t", TimeValue(c.AcceptedAt)).With("v", 0.0).With("r", 0.0).With("k", "Finite");
        await using (q.Command.ConfigureAwait(false))
        {
            DbParameterCollection ps = q.Command.Parameters;
            for (int i = 0; i < c.Readings.Count; i++)
            {
                var reading = c.Readings[i];
                ps[1].Value = i;
                ps[2].Value = TimeValue(reading.Time);
                ps[3].Value = reading.Value;
                ps[4].Value = reading.Range;
                ps[5].Value = reading.Kind.ToString();
                await q.Command.ExecuteNonQueryAsync(ct).ConfigureAwait(false);
            }
        }
    }
}
