using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Opening, resuming, finishing and listing sessions.</summary>
internal abstract partial class AdoPrecisionLog
{
    public async Task<SessionState> OpenOrResumeSessionAsync(
        SessionRequest request,
        CancellationToken cancellationToken
    )
    {
        ArgumentNullException.ThrowIfNull(request);
        Guard.Text(request.Name, nameof(request.Name));
        Guard.TextOrNull(request.Operator, nameof(request.Operator));
        var state = await WriteAsync(
                "open or resume session",
                async (s, ct) =>
                {
                    long? id = null;
                    if (request.ResumeUnfinished)
                    {
                        id = await s.Sql(
                                "SELECT id FROM sessions WHERE name = @name AND finished_at IS NULL ORDER BY id DESC "
                                    + "LIMIT 1"
                            )
                            .With("name", request.Name)
                            .ScalarLongAsync(ct)
                            .ConfigureAwait(false);
                    }

                    if (id is null && request.ReopenFinished)
                    {
                        id = await s.Sql(
                                "SELECT id FROM sessions WHERE name = @name AND finished_at IS NOT NULL ORDER BY id "
                                    + "DESC LIMIT 1"
                            )
                            .With("name", request.Name)
                            .ScalarLongAsync(ct)
                            .ConfigureAwait(false);
                        if (id is not null)
                        {
                            await s.Sql("UPDATE sessions SET finished_at = NULL WHERE id = @id")
                                .With("id", id.Value)
                                .ExecuteAsync(ct)
                                .ConfigureAwait(false);
                        }
                    }

                    bool resumed = id is not null;
                    id ??= await s.Sql(
                            "INSERT INTO sessions (name, operator_name, notes, started_at, next_part_number) "
                                + "VALUES (@name, @operator, @notes, @at, 1) RETURNING id"
                        )
                        .With("name", request.Name)
                        .With("operator", request.Operator)
                        .With("notes", request.Notes)
                        .With("at", TimeValue(Time.GetUtcNow()))
                        .ScalarLongAsync(ct)
                        .ConfigureAwait(false);
                    return await LoadStateAsync(s, id!.Value, resumed, ct).ConfigureAwait(false);
                },
                cancellationToken
            )
            .ConfigureAwait(false);
        Log.SessionOpened(
            Logger,
            state.Session.Id,
            state.Session.Name,
            state.Resumed ? "resumed" : "started",
            state.NextPartNumber
        );
        return state;
    }

    public Task<SessionInfo> FinishSessionAsync(long sessionId, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        const string operation = "finish session";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                await s.Sql("UPDATE sessions SET finished_at = @at WHERE id = @id AND finished_at IS NULL")
                    .With("at", TimeValue(Time.GetUtcNow()))
                    .With("id", sessionId)
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
                return await GetSessionCoreAsync(s, sessionId, ct).ConfigureAwait(false)
                    ?? throw NotFound(operation, $"Session {sessionId}");
            },
            cancellationToken
        );
    }

    public Task<IReadOnlyList<SessionInfo>> ListSessionsAsync(CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<SessionInfo>>(
            "list sessions",
            async (s, ct) =>
                await s.Sql($"SELECT {SessionColumns} FROM sessions s ORDER BY s.id DESC")
                    .ListAsync(ReadSession, ct)
                    .ConfigureAwait(false),
            cancellationToken
        );

    public Task<IReadOnlyList<CupTally>> GetCupCountsAsync(long sessionId, CancellationToken cancellationToken) =>
        ReadAsync("read cup counts", (s, ct) => CupCountsCoreAsync(s, sessionId, ct), cancellationToken);

    private async Task<SessionState> LoadStateAsync(DbScope s, long sessionId, bool resumed, CancellationToken ct)
    {
        var session = await GetSessionCoreAsync(s, sessionId, ct).ConfigureAwait(false)
            ?? throw NotFound("open or resume session", $"Session {sessionId}");
        var next = await s.Sql("SELECT next_part_number FROM sessions WHERE id = @id")
            .With("id", sessionId)
            .ScalarLongAsync(ct)
            .ConfigureAwait(false);
        var cups = await CupCountsCoreAsync(s, sessionId, ct).ConfigureAwait(false);
        var unannounced = await s.Sql(
                $"SELECT {PartColumns} FROM parts p WHERE p.session_id = @id AND p.state = 'Accepted' AND "
                    + $"p.announced = @no "
                    + "ORDER BY p.part_number"
            )
            .With("id", sessionId)
            .With("no", false)
            .ListAsync(ReadPart, ct)
            .ConfigureAwait(false);
        var batches = await BatchesCoreAsync(s, sessionId, ct).ConfigureAwait(false);
        return new SessionState(session, resumed, (int)next!.Value, cups, unannounced, batches);
    }

    private async Task<IReadOnlyList<CupTally>> CupCountsCoreAsync(DbScope s, long sessionId, CancellationToken ct) =>
        await s.Sql(
                $"SELECT p.cup_label, COUNT(*) FROM parts p WHERE p.session_id = @id AND p.cup_label IS NOT NULL "
                    + $"AND p.state IN {LiveStates} GROUP BY p.cup_label ORDER BY p.cup_label"
            )
            .With("id", sessionId)
            .ListAsync(r => new CupTally(r.GetString(0), (int)ReadLong(r, 1)), ct)
            .ConfigureAwait(false);
}
