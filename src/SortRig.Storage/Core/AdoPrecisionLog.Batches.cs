using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Batches and their range-transfer corrections.</summary>
internal abstract partial class AdoPrecisionLog
{
    public Task<BatchInfo> StartBatchAsync(long sessionId, BatchSetup setup, CancellationToken cancellationToken)
    {
        Guard.Id(sessionId, nameof(sessionId));
        ArgumentNullException.ThrowIfNull(setup);
        Guard.Positive(setup.Nominal, nameof(setup.Nominal));
        Guard.Positive(setup.StockTolerancePpm, nameof(setup.StockTolerancePpm));
        Guard.Positive(setup.MatchTolerancePpm, nameof(setup.MatchTolerancePpm));
        Guard.Positive(setup.Range, nameof(setup.Range));
        Guard.Positive(setup.Nplc, nameof(setup.Nplc));
        Guard.Text(setup.MeterFamily, nameof(setup.MeterFamily));
        Guard.Text(setup.MeterIdentity, nameof(setup.MeterIdentity));
        Guard.TextOrNull(setup.RecipeName, nameof(setup.RecipeName));
        const string operation = "start batch";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                var session = await GetSessionCoreAsync(s, sessionId, ct).ConfigureAwait(false)
                    ?? throw NotFound(operation, $"Session {sessionId}");
                if (session.IsFinished)
                {
                    throw Conflict(
                        operation,
                        $"session {sessionId} '{session.Name}' is finished; start or resume another."
                    );
                }

                var id = await s.Sql(
                        "INSERT INTO batches (session_id, started_at, nominal_ohms, stock_tolerance_ppm, "
                            + "match_tolerance_ppm, "
                            + "range_ohms, nplc, four_wire, meter_family, meter_identity, recipe_name) VALUES "
                            + "(@session, @at, @nominal, "
                            + "@stock, @match, @range, @nplc, @fourWire, @family, @identity, @recipe) RETURNING id"
                    )
                    .With("session", sessionId)
                    .With("at", TimeValue(Time.GetUtcNow()))
                    .With("nominal", setup.Nominal)
                    .With("stock", setup.StockTolerancePpm)
                    .With("match", setup.MatchTolerancePpm)
                    .With("range", setup.Range)
                    .With("nplc", setup.Nplc)
                    .With("fourWire", setup.FourWire)
                    .With("family", setup.MeterFamily)
                    .With("identity", setup.MeterIdentity)
                    .With("recipe", setup.RecipeName)
                    .ScalarLongAsync(ct)
                    .ConfigureAwait(false);
                return (await GetBatchCoreAsync(s, id!.Value, ct).ConfigureAwait(false))!;
            },
            cancellationToken
        );
    }

    public Task<BatchInfo> RecordRangeTransferAsync(
        long batchId,
        RangeTransferCorrection correction,
        CancellationToken cancellationToken
    )
    {
        Guard.Id(batchId, nameof(batchId));
        ArgumentNullException.ThrowIfNull(correction);
        Guard.Positive(correction.FromRange, nameof(correction.FromRange));
        Guard.Positive(correction.ToRange, nameof(correction.ToRange));
        Guard.Finite(correction.CorrectionPpm, nameof(correction.CorrectionPpm));
        Guard.NonNegative(correction.StandardUncertaintyPpm, nameof(correction.StandardUncertaintyPpm));
        const string operation = "record range transfer";
        return WriteAsync(
            operation,
            async (s, ct) =>
            {
                int rows = await s.Sql(
                        "UPDATE batches SET rt_from_range_ohms = @from, rt_to_range_ohms = @to, rt_correction_ppm = "
                            + "@ppm, "
                            + "rt_uncertainty_ppm = @u, rt_measured_at = @at WHERE id = @id"
                    )
                    .With("from", correction.FromRange)
                    .With("to", correction.ToRange)
                    .With("ppm", correction.CorrectionPpm)
                    .With("u", correction.StandardUncertaintyPpm)
                    .With("at", TimeValue(correction.MeasuredAt))
                    .With("id", batchId)
                    .ExecuteAsync(ct)
                    .ConfigureAwait(false);
                return rows == 0
                    ? throw NotFound(operation, $"Batch {batchId}")
                    : (await GetBatchCoreAsync(s, batchId, ct).ConfigureAwait(false))!;
            },
            cancellationToken
        );
    }

    public Task<IReadOnlyList<BatchInfo>> GetBatchesAsync(long sessionId, CancellationToken cancellationToken) =>
        ReadAsync("read batches", (s, ct) => BatchesCoreAsync(s, sessionId, ct), cancellationToken);

    private async Task<IReadOnlyList<BatchInfo>> BatchesCoreAsync(DbScope s, long sessionId, CancellationToken ct) =>
        await s.Sql($"SELECT {BatchColumns} FROM batches b WHERE b.session_id = @id ORDER BY b.id")
            .With("id", sessionId)
            .ListAsync(ReadBatch, ct)
            .ConfigureAwait(false);
}
