using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>
/// One library status change: which parts, from which statuses, to which, and what the history says.
/// TakenBySql is fixed SQL for the new taken_by: "@actor", "NULL" or "taken_by" (unchanged).
/// </summary>
internal sealed record StatusChange(
    string Operation,
    IReadOnlyList<long> PartIds,
    LibraryStatus[] From,
    LibraryStatus To,
    PartEventKind Event,
    string TakenBySql,
    string? Actor,
    string? Note
);

/// <summary>All-or-none library status changes.</summary>
internal abstract partial class AdoPrecisionLog
{
    /// <summary>
    /// Locks the requested rows in id order (PostgreSQL FOR UPDATE; SQLite holds the write lock since BEGIN IMMEDIATE),
    /// refuses the whole change if any part is not eligible, then updates with the status condition repeated and checks
    /// the row count. Two benches asking for overlapping parts serialise on the row locks: the second one sees the
    /// first one's result and is refused.
    /// </summary>
    private Task<LibraryResult> ChangeStatusAsync(StatusChange change, CancellationToken cancellationToken)
    {
        var ids = Guard.Ids(change.PartIds, "partIds");
        return WriteAsync(
            change.Operation,
            async (s, ct) =>
            {
                string idList = DbScope.Placeholders("i", ids.Count);
                string fromList = DbScope.Placeholders("f", change.From.Length);
                var current = await s.Sql(
                        $"SELECT p.id, p.state, p.library_status, p.taken_by FROM parts p WHERE p.id IN ({idList}) "
                            + $"ORDER BY p.id{ForUpdate}"
                    )
                    .WithList("i", ids)
                    .ListAsync(
                        r =>
                            (
                                Id: r.GetInt64(0),
                                State: Enum.Parse<PartState>(r.GetString(1)),
                                Status: Enum.Parse<LibraryStatus>(r.GetString(2)),
                                TakenBy: r.IsDBNull(3) ? null : r.GetString(3)
                            ),
                        ct
                    )
                    .ConfigureAwait(false);
                var before = current
                    .Where(c => c.State is PartState.Accepted or PartState.Announced && change.From.Contains(c.Status))
                    .ToDictionary(c => c.Id, c => c.Status);
                var refused = ids.Where(id => !before.ContainsKey(id)).ToArray();
                if (refused.Length > 0)
                {
                    s.RollbackOnly = true;
                    var holders = current
                        .Where(c => refused.Contains(c.Id))
                        .Select(c => new LibraryHolder(c.Id, c.State, c.Status, c.TakenBy))
                        .ToArray();
                    return new LibraryResult([], refused) { Holders = holders };
                }

                var update = s.Sql(
                        $"UPDATE parts SET library_status = @to, taken_by = {change.TakenBySql} WHERE id IN ({idList}) "
                            + $"AND library_status IN ({fromList}) AND state IN {LiveStates} RETURNING id"
                    )
                    .With("to", change.To.ToString())
                    .WithList("i", ids)
                    .WithList("f", change.From.Select(f => f.ToString()).ToArray());
                if (change.TakenBySql == "@actor")
                {
                    update.With("actor", change.Actor);
                }

                var changed = await update.ListAsync(r => r.GetInt64(0), ct).ConfigureAwait(false);
                if (changed.Count != ids.Count)
                {
                    s.RollbackOnly = true;
                    return new LibraryResult([], ids.Except(changed).ToArray());
                }

                foreach (var id in ids)
                {
                    await AddEventAsync(
                            s,
                            id,
                            change.Event,
                            before[id].ToString(),
                            change.To.ToString(),
                            change.Actor,
                            change.Note,
                            ct
                        )
                        .ConfigureAwait(false);
                }

                var parts = await s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.id IN ({idList}) ORDER BY p.id")
                    .WithList("i", ids)
                    .ListAsync(ReadPart, ct)
                    .ConfigureAwait(false);
                return new LibraryResult(parts, []);
            },
            cancellationToken
        );
    }
}
