using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Store check: the engine's own check plus the log's invariants.</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task<IntegrityReport> VerifyAsync(CancellationToken cancellationToken) =>
        ReadAsync(
            "verify store",
            async (s, ct) =>
            {
                int version = await ReadSchemaVersionAsync(s, ct).ConfigureAwait(false);
                var problems = new List<string>(await EngineProblemsAsync(s, ct).ConfigureAwait(false));

                // Part numbers of every session must run 1..n without gaps, and the counter must point after n.
                var numbering = await s.Sql(
                        "SELECT s.id, s.next_part_number, COUNT(p.id), COALESCE(MIN(p.part_number), 0), "
                            + "COALESCE(MAX(p.part_number), 0) "
                            + "FROM sessions s LEFT JOIN parts p ON p.session_id = s.id GROUP BY s.id, "
                            + "s.next_part_number ORDER BY s.id"
                    )
                    .ListAsync(
                        r =>
                            (
                                Session: ReadLong(r, 0),
                                Next: ReadLong(r, 1),
                                Count: ReadLong(r, 2),
                                Min: ReadLong(r, 3),
                                Max: ReadLong(r, 4)
                            ),
                        ct
                    )
                    .ConfigureAwait(false);
                foreach (var n in numbering)
                {
                    bool contiguous = n.Count == 0 ? n.Max == 0 : n.Min == 1 && n.Max == n.Count;
                    if (!contiguous || n.Next != n.Max + 1)
                    {
                        problems.Add(
                            $"session {n.Session}: {n.Count} parts numbered {n.Min}..{n.Max}, next number {n.Next}; "
                                + $"expected 1..{n.Count} and next {n.Count + 1}."
                        );
                    }
                }

                var orphans = await s.Sql(
                        "SELECT COUNT(*) FROM parts p JOIN batches b ON b.id = p.batch_id WHERE b.session_id <> "
                            + "p.session_id"
                    )
                    .ScalarLongAsync(ct)
                    .ConfigureAwait(false);
                if (orphans > 0)
                {
                    problems.Add($"{orphans} parts belong to a batch of another session.");
                }

                return new IntegrityReport(version, problems);
            },
            cancellationToken
        );
}
