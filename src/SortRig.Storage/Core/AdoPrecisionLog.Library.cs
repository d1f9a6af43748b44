using System.Text;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>The part library: search, and all-or-none status changes that never hand one part to two takers.</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task<IReadOnlyList<PartRecord>> FindPartsAsync(LibraryQuery query, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(query);
        if (query.Nominal is { } nominal)
        {
            Guard.Positive(nominal, nameof(query.Nominal));
        }
        Guard.FiniteOrNull(query.MinDeviationPpm, nameof(query.MinDeviationPpm));
        Guard.FiniteOrNull(query.MaxDeviationPpm, nameof(query.MaxDeviationPpm));
        if (query.Limit is < 1 or > 100_000)
        {
            throw new ArgumentOutOfRangeException(nameof(query), query.Limit, "Limit must be between 1 and 100 000.");
        }

        return ReadAsync<IReadOnlyList<PartRecord>>(
            "find library parts",
            async (s, ct) =>
            {
                // Only fixed SQL fragments are appended; every value is a bound parameter.
                // Parts flagged by a check out of control stay out of planning and picking until measured again.
                var sql = new StringBuilder(
                    $"SELECT {PartColumns} FROM parts p WHERE p.state IN {LiveStates} "
                        + "AND NOT EXISTS (SELECT 1 FROM suspect_parts sp WHERE sp.part_id = p.id)"
                );
                if (query.Nominal is not null)
                {
                    sql.Append(" AND p.nominal_ohms BETWEEN @nlo AND @nhi");
                }
                if (query.MinDeviationPpm is not null)
                {
                    sql.Append(" AND p.deviation_ppm >= @dlo");
                }
                if (query.MaxDeviationPpm is not null)
                {
                    sql.Append(" AND p.deviation_ppm <= @dhi");
                }
                if (query.Status is not null)
                {
                    sql.Append(" AND p.library_status = @status");
                }
                if (query.Location is not null)
                {
                    sql.Append(" AND p.location = @location");
                }
                sql.Append(" ORDER BY p.deviation_ppm, p.id LIMIT @limit");
                var q = s.Sql(sql.ToString()).With("limit", query.Limit);
                if (query.Nominal is { } n)
                {
                    q.With("nlo", n * (1 - 1e-9)).With("nhi", n * (1 + 1e-9));
                }
                if (query.MinDeviationPpm is { } lo)
                {
                    q.With("dlo", lo);
                }
                if (query.MaxDeviationPpm is { } hi)
                {
                    q.With("dhi", hi);
                }
                if (query.Status is { } st)
                {
                    q.With("status", st.ToString());
                }
                if (query.Location is { } loc)
                {
                    q.With("location", loc);
                }
                return await q.ListAsync(ReadPart, ct).ConfigureAwait(false);
            },
            cancellationToken
        );
    }

    public Task<LibraryResult> TakePartsAsync(
        IReadOnlyList<long> partIds,
        string takenBy,
        CancellationToken cancellationToken
    )
    {
        Guard.Text(takenBy, nameof(takenBy));
        return ChangeStatusAsync(
            new StatusChange(
                "take parts",
                partIds,
                [LibraryStatus.Available],
                LibraryStatus.Taken,
                PartEventKind.Taken,
                "@actor",
                takenBy,
                null
            ),
            cancellationToken
        );
    }

    public Task<LibraryResult> ReleasePartsAsync(IReadOnlyList<long> partIds, CancellationToken cancellationToken) =>
        ChangeStatusAsync(
            new StatusChange(
                "release parts",
                partIds,
                [LibraryStatus.Taken],
                LibraryStatus.Available,
                PartEventKind.Released,
                "NULL",
                null,
                null
            ),
            cancellationToken
        );

    public Task<LibraryResult> MarkUsedAsync(
        IReadOnlyList<long> partIds,
        string? usedIn,
        CancellationToken cancellationToken
    )
    {
        Guard.TextOrNull(usedIn, nameof(usedIn));
        return ChangeStatusAsync(
            new StatusChange(
                "mark parts used",
                partIds,
                [LibraryStatus.Taken],
                LibraryStatus.Used,
                PartEventKind.Used,
                "taken_by",
                null,
                usedIn
            ),
            cancellationToken
        );
    }

    public Task<LibraryResult> RetireAsync(
        IReadOnlyList<long> partIds,
        string reason,
        CancellationToken cancellationToken
    )
    {
        Guard.Text(reason, nameof(reason));
        return ChangeStatusAsync(
            new StatusChange(
                "retire parts",
                partIds,
                [LibraryStatus.Available, LibraryStatus.Taken, LibraryStatus.Used],
                LibraryStatus.Retired,
                PartEventKind.Retired,
                "taken_by",
                null,
                reason
            ),
            cancellationToken
        );
    }

    public Task<PartRecord> SetLocationAsync(long partId, string? location, CancellationToken cancellationToken)
    {
        Guard.Id(partId, nameof(partId));
        Guard.TextOrNull(location, nameof(location));
        const string operation = "set part location";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                var part = await s.Sql($"SELECT {PartColumns} FROM parts p WHERE p.id = @id{ForUpdate}")
                    .With("id", partId)
                    .FirstOrDefaultAsync(ReadPart, ct)
                    .ConfigureAwait(false)
                    ?? throw NotFound(operation, $"Part {partId}");
                await s.Sql("UPDATE parts SET location = @location WHERE id = @id")
                    .With("location", location)
                    .With("id", partId)
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
                await AddEventAsync(s, partId, PartEventKind.Relocated, part.Location, location, null, null, ct)
                    .ConfigureAwait(false);
                return (await GetPartCoreAsync(s, partId, ct).ConfigureAwait(false))!;
            },
            cancellationToken
        );
    }
}
