using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Operator corrections of committed parts; every change leaves a history entry.</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task<PartRecord> UndoPartAsync(PartCorrection correction, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(correction);
        Guard.Id(correction.PartId, nameof(correction.PartId));
        if (correction.Kind == PartCorrectionKind.MoveToCup)
        {
            Guard.Text(correction.NewCupLabel, nameof(correction.NewCupLabel));
        }

        return WriteAsync(
            $"correct part ({correction.Kind})",
            (s, ct) => CorrectCoreAsync(s, correction, ct),
            cancellationToken
        );
    }

    private async Task<PartRecord> CorrectCoreAsync(DbScope s, PartCorrection correction, CancellationToken ct)
    {
        string operation = $"correct part ({correction.Kind})";
        var part = await s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.id = @id{ForUpdate}")
            .With("id", correction.PartId)
            .FirstOrDefaultAsync(ReadPart, ct)
            .ConfigureAwait(false)
            ?? throw NotFound(operation, $"Part {correction.PartId}");
        var (allowed, newState, kind) = correction.Kind switch
        {
            PartCorrectionKind.Undo => (
                part.IsLive || part.State == PartState.Unstable,
                PartState.Undone,
                PartEventKind.Undone
            ),
            PartCorrectionKind.Remeasure => (
                part.IsLive || part.State == PartState.Unstable,
                PartState.Remeasured,
                PartEventKind.Remeasured
            ),
            PartCorrectionKind.RemoveEarly => (part.IsLive, PartState.RemovedEarly, PartEventKind.RemovedEarly),
            _ => (part.IsLive, part.State, PartEventKind.CupCorrected),
        };
        if (!allowed)
        {
            throw Conflict(
                operation,
                $"part {part.Id} (number {part.Number} of session {part.SessionId}) is {part.State}; "
                    + $"{correction.Kind} needs a part that is Accepted or Announced."
            );
        }

        var newCup = correction.Kind == PartCorrectionKind.MoveToCup ? correction.NewCupLabel : part.CupLabel;
        await s.Sql("UPDATE parts SET state = @state, cup_label = @cup WHERE id = @id")
            .With("state", newState.ToString())
            .With("cup", newCup)
            .With("id", part.Id)
            .ExecuteAsync(ct)
            .ConfigureAwait(false);
        var (before, after) =
            kind == PartEventKind.CupCorrected ? (part.CupLabel, newCup) : (part.State.ToString(), newState.ToString());
        await AddEventAsync(s, part.Id, kind, before, after, null, correction.Note, ct).ConfigureAwait(false);
        return (await GetPartCoreAsync(s, part.Id, ct).ConfigureAwait(false))!;
    }

    public Task<IReadOnlyList<PartEvent>> GetPartHistoryAsync(long partId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<PartEvent>>(
            "read part history",
            async (s, ct) =>
                await s.Sql($"SELECT {EventColumns} FROM part_events e WHERE e.part_id = @id ORDER BY e.id")
                    .With("id", partId)
                    .ListAsync(ReadEvent, ct)
                    .ConfigureAwait(false),
            cancellationToken
        );

    private protected async Task AddEventAsync(
        DbScope s,
        long partId,
        PartEventKind kind,
        string? before,
        string? after,
        string? actor,
        string? note,
        CancellationToken ct
    ) =>
        await s.Sql(
                "INSERT INTO part_events (part_id, happened_at, kind, before_value, after_value, actor, note) "
                    + "VALUES (@part, @at, @kind, @before, @after, @actor, @note)"
            )
            .With("part", partId)
            .With("at", TimeValue(Time.GetUtcNow()))
            .With("kind", kind.ToString())
            .With("before", before)
            .With("after", after)
            .With("actor", actor)
            .With("note", note)
            .ExecuteAsync(ct)
            .ConfigureAwait(false);
}
