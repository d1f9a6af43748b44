using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Overnight drift logs: runs, batched sample appends, gaps, streamed reads.</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task<DriftRun> StartDriftRunAsync(DriftRunRequest request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        Guard.Text(request.Name, nameof(request.Name));
        ArgumentNullException.ThrowIfNull(request.Channels, nameof(request.Channels));
        if (request.Channels.Count is 0 or > 1000)
        {
            throw new ArgumentException(
                $"Channels must hold 1..1000 channels, not {request.Channels.Count}.",
                nameof(request)
            );
        }

        foreach (var channel in request.Channels)
        {
            Guard.Text(channel.Label, "Channels[].Label");
        }

        if (request.Interval <= TimeSpan.Zero)
        {
            throw new ArgumentOutOfRangeException(nameof(request), request.Interval, "Interval must be > 0.");
        }

        return WriteAsync(
            "start drift run",
            async (s, ct) =>
            {
                var id = (
                    await s.Sql(
                            "INSERT INTO drift_runs (name, started_at, interval_us, notes) VALUES (@name, @at, "
                                + "@interval, @notes) RETURNING id"
                        )
                        .With("name", request.Name)
                        .With("at", TimeValue(Time.GetUtcNow()))
                        .With("interval", request.Interval.Ticks / 10)
                        .With("notes", request.Notes)
                        .ScalarLongAsync(ct)
                        .ConfigureAwait(false)
                )!.Value;
                for (int i = 0; i < request.Channels.Count; i++)
                {
                    await s.Sql(
                            "INSERT INTO drift_channels (run_id, channel, label, part_id) VALUES (@run, @channel, "
                                + "@label, @part)"
                        )
                        .With("run", id)
                        .With("channel", i)
                        .With("label", request.Channels[i].Label)
                        .With("part", request.Channels[i].PartId)
                        .ExecuteAsync(ct)
                        .ConfigureAwait(false);
                }

                return (await GetDriftRunCoreAsync(s, id, ct).ConfigureAwait(false))!;
            },
            cancellationToken
        );
    }

    public Task<int> AppendDriftSamplesAsync(
        IReadOnlyList<StoredDriftSample> samples,
        CancellationToken cancellationToken
    )
    {
        ArgumentNullException.ThrowIfNull(samples);
        for (int i = 0; i < samples.Count; i++)
        {
            if (samples[i].Channel < 0 || double.IsNaN(samples[i].Ohms) || samples[i].Temperature is double.NaN)
            {
                throw new ArgumentException(
                    $"samples[{i}] must have a channel >= 0 and a value that is not NaN.",
                    nameof(samples)
                );
            }
        }

        return samples.Count == 0
            ? Task.FromResult(0)
            : WriteAsync("append drift samples", (s, ct) => InsertDriftSamplesAsync(s, samples, ct), cancellationToken);
    }

    public Task MarkGapAsync(DriftGap gap, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(gap);
        Guard.Text(gap.Reason, nameof(gap.Reason));
        if (gap.To < gap.From)
        {
            throw new ArgumentOutOfRangeException(nameof(gap), gap.To, "To must not be before From.");
        }

        return WriteAsync(
            "mark drift gap",
            (s, ct) =>
                s.Sql("INSERT INTO drift_gaps (run_id, from_at, to_at, reason) VALUES (@run, @from, @to, @reason)")
                    .With("run", gap.RunId)
                    .With("from", TimeValue(gap.From))
                    .With("to", TimeValue(gap.To))
                    .With("reason", gap.Reason)
                    .ExecuteAsync(ct),
            cancellationToken
        );
    }

    public Task<DriftRun?> GetDriftRunAsync(long runId, CancellationToken cancellationToken) =>
        ReadAsync("read drift run", (s, ct) => GetDriftRunCoreAsync(s, runId, ct), cancellationToken);

    public Task<IReadOnlyList<DriftGap>> GetDriftGapsAsync(long runId, CancellationToken cancellationToken) =>
        ReadAsync<IReadOnlyList<DriftGap>>(
            "read drift gaps",
            async (s, ct) =>
                await s.Sql(
                        "SELECT run_id, from_at, to_at, reason FROM drift_gaps WHERE run_id = @run ORDER BY from_at, id"
                    )
                    .With("run", runId)
                    .ListAsync(r => new DriftGap(r.GetInt64(0), ReadTime(r, 1), ReadTime(r, 2), r.GetString(3)), ct)
                    .ConfigureAwait(false),
            cancellationToken
        );

    private async Task<DriftRun?> GetDriftRunCoreAsync(DbScope s, long runId, CancellationToken ct)
    {
        var channels = await s.Sql("SELECT label, part_id FROM drift_channels WHERE run_id = @run ORDER BY channel")
            .With("run", runId)
            .ListAsync(r => new DriftChannel(r.GetString(0), r.IsDBNull(1) ? null : r.GetInt64(1)), ct)
            .ConfigureAwait(false);
        return await s.Sql("SELECT id, name, started_at, interval_us, notes FROM drift_runs WHERE id = @run")
            .With("run", runId)
            .FirstOrDefaultAsync(
                r => new DriftRun(
                    r.GetInt64(0),
                    r.GetString(1),
                    ReadTime(r, 2),
                    TimeSpan.FromTicks(r.GetInt64(3) * 10),
                    channels,
                    ReadText(r, 4)
                ),
                ct
            )
            .ConfigureAwait(false);
    }
}
