using System.Data.Common;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>The check standard's readings and the parts they flag (schema version 5).</summary>
internal abstract partial class AdoPrecisionLog
{
    private const string CheckColumns =
        "c.id, c.seq, c.after_part_number, c.flagged_count, c.commit_key, c.session_id, c.check_name, c.taken_at, "
        + "c.value_ohms, c.range_ohms, c.u_standard_ohms, c.calibrated_ohms, c.centre_ohms, c.sigma_ohms, "
        + "c.in_control, "
        + "c.rule, c.reason, c.scale_factor";

    public Task<CheckRecord> RecordCheckAsync(CheckCommit commit, CancellationToken cancellationToken)
    {
        CheckArguments(commit);
        const string operation = "record check";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                if (await FindCheckAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } earlier)
                {
                    s.RollbackOnly = true; // a retry after a crash: the first write stands, nothing is counted twice
                    return earlier;
                }

                // Touching the session row locks it (PostgreSQL) so that concurrent checks of one session number in
                // turn.
                int open = await s.Sql(
                        "UPDATE sessions SET next_part_number = next_part_number WHERE id = @id AND finished_at IS NULL"
                    )
                    .With("id", commit.SessionId)
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
                if (open == 0)
                {
                    var session = await GetSessionCoreAsync(s, commit.SessionId, ct).ConfigureAwait(false);
                    throw session is null
                        ? NotFound(operation, $"Session {commit.SessionId}")
                        : Conflict(
                            operation,
                            $"session {commit.SessionId} '{session.Name}' is finished; no checks can be added."
                        );
                }

                if (await FindCheckAsync(s, commit.CommitKey, ct).ConfigureAwait(false) is { } raced)
                {
                    s.RollbackOnly = true;
                    return raced;
                }

                long seq = await s.Sql("SELECT COALESCE(MAX(seq), 0) + 1 FROM check_readings WHERE session_id = @id")
                    .With("id", commit.SessionId)
                    .ScalarLongAsync(ct)
                    .ConfigureAwait(false)
                    ?? 1;
                long after = await s.Sql("SELECT COALESCE(MAX(part_number), 0) FROM parts WHERE session_id = @id")
                    .With("id", commit.SessionId)
                    .ScalarLongAsync(ct)
                    .ConfigureAwait(false)
                    ?? 0;
                long checkId = await InsertCheckAsync(s, commit, (int)seq, (int)after, ct).ConfigureAwait(false);
                if (!commit.InControl)
                {
                    await FlagSinceLastGoodAsync(s, commit.SessionId, checkId, ct).ConfigureAwait(false);
                }

                return (await FindCheckAsync(s, commit.CommitKey, ct).ConfigureAwait(false))!;
            },
            cancellationToken
        );
    }

    public Task<IReadOnlyList<CheckRecord>> GetSessionChecksAsync(long sessionId, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        return ReadAsync<IReadOnlyList<CheckRecord>>(
            "read session checks",
            async (s, ct) =>
                await s.Sql($"SELECT {CheckColumns} FROM check_readings c WHERE c.session_id = @id ORDER BY c.seq")
                    .With("id", sessionId)
                    .ListAsync(ReadCheck, ct)
                    .ConfigureAwait(false),
            cancellationToken
        );
    }

    public Task<IReadOnlyList<CheckRecord>> GetCheckHistoryAsync(
        string checkName,
        int limit,
        CancellationToken cancellationToken
    )
    {
        Guard.Text(checkName, nameof(checkName));
        if (limit is < 1 or > 100_000)
        {
            throw new ArgumentOutOfRangeException(nameof(limit), limit, "limit must be between 1 and 100 000.");
        }

        return ReadAsync<IReadOnlyList<CheckRecord>>(
            "read check history",
            async (s, ct) =>
            {
                var newest = await s.Sql(
                        $"SELECT {CheckColumns} FROM check_readings c WHERE c.check_name = @name "
                            + "ORDER BY c.taken_at DESC, c.id DESC LIMIT @limit"
                    )
                    .With("name", checkName)
                    .With("limit", limit)
                    .ListAsync(ReadCheck, ct)
                    .ConfigureAwait(false);
                newest.Reverse();
                return newest;
            },
            cancellationToken
        );
    }

    public Task<IReadOnlyList<long>> GetSuspectPartsAsync(long sessionId, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        return ReadAsync<IReadOnlyList<long>>(
            "read suspect parts",
            async (s, ct) =>
                await s.Sql(
                        "SELECT p.id FROM parts p JOIN suspect_parts sp ON sp.part_id = p.id "
                            + $"WHERE p.session_id = @id AND p.state IN {LiveStates} ORDER BY p.part_number"
                    )
                    .With("id", sessionId)
                    .ListAsync(r => r.GetInt64(0), ct)
                    .ConfigureAwait(false),
            cancellationToken
        );
    }

    public Task<IReadOnlyList<long>> GetFlaggedPartsAsync(long sessionId, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        return ReadAsync<IReadOnlyList<long>>(
            "read flagged parts",
            async (s, ct) =>
                await s.Sql(
                        "SELECT p.id FROM parts p JOIN suspect_parts sp ON sp.part_id = p.id "
                            + "WHERE p.session_id = @id ORDER BY p.part_number"
                    )
                    .With("id", sessionId)
                    .ListAsync(r => r.GetInt64(0), ct)
                    .ConfigureAwait(false),
            cancellationToken
        );
    }

    private async Task FlagSinceLastGoodAsync(DbScope s, long sessionId, long checkId, CancellationToken ct)
    {
        long since = await s.Sql(
                "SELECT COALESCE(MAX(after_part_number), 0) FROM check_readings "
                    + "WHERE session_id = @id AND in_control = @yes"
            )
            .With("id", sessionId)
            .With("yes", true)
            .ScalarLongAsync(ct)
            .ConfigureAwait(false)
            ?? 0;
        int flagged = await s.Sql(
                "INSERT INTO suspect_parts (part_id, check_id) SELECT p.id, @check FROM parts p "
                    + $"WHERE p.session_id = @id AND p.part_number > @since AND p.state IN {LiveStates} "
                    + "AND NOT EXISTS (SELECT 1 FROM suspect_parts sp WHERE sp.part_id = p.id)"
            )
            .With("check", checkId)
            .With("id", sessionId)
            .With("since", since)
            .ExecuteAsync(ct)
            .ConfigureAwait(false);
        await s.Sql("UPDATE check_readings SET flagged_count = @n WHERE id = @check")
            .With("n", flagged)
            .With("check", checkId)
            .ExecuteAsync(ct)
            .ConfigureAwait(false);
    }

    private async Task<long> InsertCheckAsync(DbScope s, CheckCommit c, int seq, int after, CancellationToken ct) =>
        await s.Sql(
                "INSERT INTO check_readings (commit_key, session_id, seq, check_name, taken_at, value_ohms, "
                    + "range_ohms, u_standard_ohms, calibrated_ohms, centre_ohms, sigma_ohms, in_control, rule, "
                    + "reason, "
                    + "after_part_number, flagged_count, scale_factor) VALUES (@key, @session, @seq, @name, @at, "
                    + "@value, @range, @u, @cal, @centre, @sigma, "
                    + "@ok, @rule, @reason, @after, 0, @scale) RETURNING id"
            )
            .With("key", GuidValue(c.CommitKey))
            .With("session", c.SessionId)
            .With("seq", seq)
            .With("name", c.CheckName)
            .With("at", TimeValue(c.At))
            .With("value", c.ValueOhms)
            .With("range", c.RangeOhms)
            .With("u", c.UStandardOhms)
            .With("cal", c.CalibratedOhms)
            .With("centre", c.CentreOhms)
            .With("sigma", c.SigmaOhms)
            .With("ok", c.InControl)
            .With("rule", c.Rule)
            .With("reason", c.Reason)
            .With("after", after)
            .With("scale", c.ScaleFactor)
            .ScalarLongAsync(ct)
            .ConfigureAwait(false)
        ?? throw new InvalidOperationException("INSERT returned no id.");

    private Task<CheckRecord?> FindCheckAsync(DbScope s, Guid key, CancellationToken ct) =>
        s.Sql($"SELECT {CheckColumns} FROM check_readings c WHERE c.commit_key = @key")
            .With("key", GuidValue(key))
            .FirstOrDefaultAsync(ReadCheck, ct);

    private CheckRecord ReadCheck(DbDataReader r) =>
        new(
            r.GetInt64(0),
            (int)ReadLong(r, 1),
            (int)ReadLong(r, 2),
            (int)ReadLong(r, 3),
            new CheckCommit(
                r.GetGuid(4),
                r.GetInt64(5),
                r.GetString(6),
                ReadTime(r, 7),
                r.GetDouble(8),
                r.GetDouble(9),
                r.GetDouble(10),
                ReadDouble(r, 11),
                ReadDouble(r, 12),
                ReadDouble(r, 13),
                r.GetBoolean(14),
                r.GetString(15),
                ReadText(r, 16),
                r.GetDouble(17)
            )
        );

    private static void CheckArguments(CheckCommit commit)
    {
        ArgumentNullException.ThrowIfNull(commit);
        Guard.Id(commit.SessionId, nameof(commit.SessionId));
        Guard.Text(commit.CheckName, nameof(commit.CheckName));
        Guard.Positive(commit.ValueOhms, nameof(commit.ValueOhms));
        Guard.Positive(commit.RangeOhms, nameof(commit.RangeOhms));
        Guard.NonNegative(commit.UStandardOhms, nameof(commit.UStandardOhms));
        if (commit.CalibratedOhms is { } cal)
        {
            Guard.Positive(cal, nameof(commit.CalibratedOhms));
        }
        Guard.FiniteOrNull(commit.CentreOhms, nameof(commit.CentreOhms));
        if (commit.SigmaOhms is { } sigma)
        {
            Guard.NonNegative(sigma, nameof(commit.SigmaOhms));
        }
        Guard.Text(commit.Rule, nameof(commit.Rule));
        Guard.TextOrNull(commit.Reason, nameof(commit.Reason));
        Guard.Positive(commit.ScaleFactor, nameof(commit.ScaleFactor));
    }
}
