using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Committing parts with their readings, announcing them, reading them back.</summary>
internal abstract partial class AdoPrecisionLog
{
    public async Task<PartRecord> CommitPartAsync(PartCommit commit, CancellationToken cancellationToken)
    {
        PartCommitRules.Check(commit);
        return await WriteAsync(CommitOperation, (s, ct) => CommitCoreAsync(s, commit, ct), cancellationToken)
            .ConfigureAwait(false);
    }

    public async Task<PartRecord> CommitRemeasureAsync(
        PartCommit commit,
        PartCorrection replaced,
        CancellationToken cancellationToken
    )
    {
        PartCommitRules.Check(commit);
        ArgumentNullException.ThrowIfNull(replaced);
        Guard.Id(replaced.PartId, nameof(replaced.PartId));
        if (replaced.Kind != PartCorrectionKind.Remeasure)
        {
            throw new ArgumentException("the replaced part's correction must be Remeasure", nameof(replaced));
        }

        return await WriteAsync(
                "commit part measured again",
                async (s, ct) =>
                {
                    // One transaction: the new record and the old one marked measured again land together or not
                    // at all, so a crash between them can neither lose the part nor keep it twice. A retry finds the
                    // first attempt by commit key; the old part is then already marked.
                    var stored = await CommitCoreAsync(s, commit, ct).ConfigureAwait(false);
                    var old = await GetPartCoreAsync(s, replaced.PartId, ct).ConfigureAwait(false);
                    if (old is { State: not PartState.Remeasured })
                    {
                        var note = replaced.Note is { } n ? $"{n}{stored.Number}" : null;
                        await CorrectCoreAsync(s, replaced with { Note = note }, ct).ConfigureAwait(false);
                        await s.Sql("UPDATE parts SET replaced_by = @new WHERE id = @id")
                            .With("new", stored.Id)
                            .With("id", replaced.PartId)
                            .ExecuteAsync(ct)
                            .ConfigureAwait(false);
                    }
                    else if (old is null)
                    {
                        throw NotFound("commit part measured again", $"Part {replaced.PartId}");
                    }

                    return stored;
                },
                cancellationToken
            )
            .ConfigureAwait(false);
    }

    private const string CommitOperation = "commit part";

    private async Task<PartRecord> CommitCoreAsync(DbScope s, PartCommit commit, CancellationToken ct)
    {
        const string operation = CommitOperation;
        // A retried commit (after a crash or timeout) finds its first attempt and writes nothing.
        if (await FindByKeyAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } earlier)
        {
            return Duplicate(s, earlier);
        }

        // Allocating the number locks the session row (PostgreSQL) inside the write transaction; a
        // rolled-back commit gives its number back, so numbers stay contiguous.
        var number = await s.Sql(
                "UPDATE sessions SET next_part_number = next_part_number + 1 WHERE id = @id AND "
                    + "finished_at IS NULL "
                    + "RETURNING next_part_number - 1"
            )
            .With("id", commit.SessionId)
            .ScalarLongAsync(ct)
            .ConfigureAwait(false);
        if (number is null)
        {
            var session = await GetSessionCoreAsync(s, commit.SessionId, ct).ConfigureAwait(false);
            throw session is null
                ? NotFound(operation, $"Session {commit.SessionId}")
                : Conflict(
                    operation,
                    $"session {commit.SessionId} '{session.Name}' is finished; no parts can be added."
                );
        }

        // Under PostgreSQL READ COMMITTED a concurrent retry with the same key may have committed while we
        // waited for the session row; this statement sees it.
        if (await FindByKeyAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } raced)
        {
            return Duplicate(s, raced);
        }

        var batch = await GetBatchCoreAsync(s, commit.BatchId, ct).ConfigureAwait(false);
        if (batch is null || batch.SessionId != commit.SessionId)
        {
            throw NotFound(operation, $"Batch {commit.BatchId} of session {commit.SessionId}");
        }

        long partId = await InsertPartAsync(s, commit, (int)number.Value, batch.Setup.Nominal, ct)
            .ConfigureAwait(false);
        await InsertReadingsAsync(s, partId, commit, ct).ConfigureAwait(false);
        if (commit.ReelPrior is { } prior)
        {
            // With the part, in its transaction: a resumed session never goes on from a prior ahead of its parts.
            await s.Sql("UPDATE batches SET reel_prior = @prior WHERE id = @id")
                .With("prior", ReelPriorText.Write(prior))
                .With("id", commit.BatchId)
                .ExecuteAsync(ct)
                .ConfigureAwait(false);
        }

        return (await GetPartCoreAsync(s, partId, ct).ConfigureAwait(false))!;
    }

    public Task<PartRecord> MarkAnnouncedAsync(long partId, CancellationToken cancellationToken)
    {
        Guard.Id(partId, nameof(partId));
        const string operation = "mark part announced";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                await s.Sql(
                        "UPDATE parts SET announced = @yes, state = CASE WHEN state = 'Accepted' THEN 'Announced' "
                            + "ELSE state END "
                            + "WHERE id = @id"
                    )
                    .With("yes", true)
                    .With("id", partId)
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
                return await GetPartCoreAsync(s, partId, ct).ConfigureAwait(false)
                    ?? throw NotFound(operation, $"Part {partId}");
            },
            cancellationToken
        );
    }

    public Task<IReadOnlyList<PartRecord>> GetPartsAsync(long sessionId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<PartRecord>>(
            "read parts",
            async (s, ct) =>
                await s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.session_id = @id ORDER BY p.part_number")
                    .With("id", sessionId)
                    .ListAsync(ReadPart, ct)
                    .ConfigureAwait(false),
            cancellationToken
        );

    public Task<PartRecord?> GetPartAsync(long partId, CancellationToken cancellationToken) =>
        ReadAsync("read part", (s, ct) => GetPartCoreAsync(s, partId, ct), cancellationToken);

    public Task<IReadOnlyList<RawReading>> GetReadingsAsync(long partId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<RawReading>>(
            "read raw readings",
            async (s, ct) =>
                await s.Sql(
                        "SELECT part_id, seq, taken_at, value_ohms, range_ohms, kind FROM raw_readings WHERE part_id "
                            + "= @id ORDER BY seq"
                    )
                    .With("id", partId)
                    .ListAsync(ReadRawReading, ct)
                    .ConfigureAwait(false),
            cancellationToken
        );

    private PartRecord Duplicate(DbScope s, PartRecord earlier)
    {
        s.RollbackOnly = true;
        Log.DuplicateCommit(Logger, earlier.CommitKey, earlier.Id);
        return earlier;
    }

    private Task<PartRecord?> FindByKeyAsync(DbScope s, Guid key, CancellationToken ct) =>
        s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.commit_key = @key")
            .With("key", GuidValue(key))
            .FirstOrDefaultAsync(ReadPart, ct);
}
