using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Which drift runs a library part was logged in, with the extent of its channel's samples.</summary>
internal abstract partial class AdoPrecisionLog
{
    /// <summary>Ids bound per statement: far below SQLite's 32 766 and PostgreSQL's 65 535 parameters.</summary>
    private const int PartDriftChunk = 1000;

    // One row per (part, run, channel). The LEFT JOIN keeps channels without samples (count 0, no times); with
    // ix_drift_samples_channel (0002) each channel's MIN/MAX/COUNT is a range of one index instead of a scan of the
    // run.
    /// <summary>The query with an optional filter (a fixed fragment with placeholders, never a value).</summary>
    internal static string PartDriftSql(string filter) =>
        "SELECT c.part_id, r.id, r.name, r.started_at, c.channel, c.label, MIN(d.taken_at), MAX(d.taken_at), "
        + "COUNT(d.taken_at) "
        + "FROM drift_channels c JOIN drift_runs r ON r.id = c.run_id "
        + "LEFT JOIN drift_samples d ON d.run_id = c.run_id AND d.channel = c.channel "
        + "WHERE c.part_id IS NOT NULL"
        + filter
        + " "
        + "GROUP BY c.part_id, r.id, r.name, r.started_at, c.channel, c.label "
        + "ORDER BY c.part_id, r.started_at, r.id, c.channel";

    public Task<IReadOnlyList<PartDriftRun>> GetPartDriftRunsAsync(
        IReadOnlyList<long>? partIds,
        CancellationToken cancellationToken
    )
    {
        long[]? ids = null;
        if (partIds is not null)
        {
            foreach (var id in partIds)
            {
                Guard.Id(id, nameof(partIds));
            }

            ids = partIds.Distinct().Order().ToArray();
            if (ids.Length == 0)
            {
                return Task.FromResult<IReadOnlyList<PartDriftRun>>([]);
            }
        }

        return ReadAsync<IReadOnlyList<PartDriftRun>>(
            "read drift runs of parts",
            async (s, ct) =>
            {
                if (ids is null)
                {
                    return await s.Sql(PartDriftSql("")).ListAsync(ReadPartDriftRun, ct).ConfigureAwait(false);
                }

                // Chunks are in ascending id order and the rows of one part never span two chunks, so the order holds.
                var rows = new List<PartDriftRun>();
                foreach (var chunk in ids.Chunk(PartDriftChunk))
                {
                    var filter = $" AND c.part_id IN ({DbScope.Placeholders("i", chunk.Length)})";
                    rows.AddRange(
                        await s.Sql(PartDriftSql(filter))
                            .WithList("i", chunk)
                            .ListAsync(ReadPartDriftRun, ct)
                            .ConfigureAwait(false)
                    );
                }

                return rows;
            },
            cancellationToken
        );
    }

    private PartDriftRun ReadPartDriftRun(System.Data.Common.DbDataReader r) =>
        new(
            r.GetInt64(0),
            r.GetInt64(1),
            r.GetString(2),
            ReadTime(r, 3),
            (int)ReadLong(r, 4),
            r.GetString(5),
            ReadTimeOrNull(r, 6),
            ReadTimeOrNull(r, 7),
            ReadLong(r, 8)
        );
}
