using System.Data.Common;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Storage.Core;

/// <summary>Column lists and row-to-record maps; ordinals follow the column lists.</summary>
internal abstract partial class AdoPrecisionLog
{
    private protected const string SessionColumns =
        "s.id, s.name, s.operator_name, s.notes, s.started_at, s.finished_at";

    private protected const string BatchColumns =
        "b.id, b.session_id, b.started_at, b.nominal_ohms, b.stock_tolerance_ppm, b.match_tolerance_ppm, b.range_ohms, "
        + "b.nplc, b.four_wire, b.meter_family, b.meter_identity, b.recipe_name, b.rt_from_range_ohms, "
        + "b.rt_to_range_ohms, "
        + "b.rt_correction_ppm, b.rt_uncertainty_ppm, b.rt_measured_at, b.reel_prior";

    private protected const string PartColumns =
        "p.id, p.commit_key, p.session_id, p.batch_id, p.part_number, p.nominal_ohms, p.value_ohms, p.u_standard_ohms, "
        + "p.u_transfer_ohms, p.coverage_k, p.range_ohms, p.nplc, p.temperature_c, p.accepted_at, p.cup_label, "
        + "p.slot_label, "
        + "p.state, p.announced, p.location, p.library_status, p.taken_by, "
        + SettleColumns
        + ", p.replaced_by, EXISTS (SELECT 1 FROM suspect_parts sp WHERE sp.part_id = p.id AND p.state IN "
        + LiveStates
        + ")";

    /// <summary>Ordinal of replaced_by in a row read with the part columns (after the settle columns).</summary>
    private const int ReplacedOrdinal = SettleOrdinal + 12;

    private protected const string EventColumns =
        "e.id, e.part_id, e.happened_at, e.kind, e.before_value, e.after_value, e.actor, e.note";

    /// <summary>Parts that sit in a cup and take part in the library.</summary>
    private protected const string LiveStates = "('Accepted', 'Announced')";

    private protected SessionInfo ReadSession(DbDataReader r) =>
        new(r.GetInt64(0), r.GetString(1), ReadText(r, 2), ReadText(r, 3), ReadTime(r, 4), ReadTimeOrNull(r, 5));

    private protected BatchInfo ReadBatch(DbDataReader r)
    {
        var setup = new BatchSetup(
            r.GetDouble(3),
            r.GetDouble(4),
            r.GetDouble(5),
            r.GetDouble(6),
            r.GetDouble(7),
            r.GetBoolean(8),
            r.GetString(9),
            r.GetString(10),
            ReadText(r, 11)
        );
        var transfer = r.IsDBNull(12)
            ? null
            : new RangeTransferCorrection(
                r.GetDouble(12),
                r.GetDouble(13),
                r.GetDouble(14),
                r.GetDouble(15),
                ReadTime(r, 16)
            );
        if (!ReelPriorText.TryRead(ReadText(r, 17), out var prior, out var reason))
        {
            Log.UnreadableReelPrior(Logger, r.GetInt64(0), reason!);
        }

        return new BatchInfo(r.GetInt64(0), r.GetInt64(1), ReadTime(r, 2), setup, transfer, prior);
    }

    private protected PartRecord ReadPart(DbDataReader r)
    {
        var (acceptedBy, fit) = ReadSettle(r);
        return new(
            Id: r.GetInt64(0),
            CommitKey: r.GetGuid(1),
            SessionId: r.GetInt64(2),
            BatchId: r.GetInt64(3),
            Number: r.GetInt32(4),
            Nominal: r.GetDouble(5),
            Measured: new MeasuredValue(r.GetDouble(6), r.GetDouble(7), r.GetDouble(8), r.GetDouble(9)),
            Range: r.GetDouble(10),
            Nplc: r.GetDouble(11),
            Temperature: ReadDouble(r, 12),
            AcceptedAt: ReadTime(r, 13),
            CupLabel: ReadText(r, 14),
            SlotLabel: ReadText(r, 15),
            State: Enum.Parse<PartState>(r.GetString(16)),
            Announced: r.GetBoolean(17),
            Location: ReadText(r, 18),
            LibraryStatus: Enum.Parse<LibraryStatus>(r.GetString(19)),
            TakenBy: ReadText(r, 20),
            AcceptedBy: acceptedBy,
            Fit: fit,
            ReplacedBy: r.IsDBNull(ReplacedOrdinal) ? null : r.GetInt64(ReplacedOrdinal),
            Suspect: r.GetBoolean(ReplacedOrdinal + 1)
        );
    }

    private protected PartEvent ReadEvent(DbDataReader r) =>
        new(
            r.GetInt64(0),
            r.GetInt64(1),
            ReadTime(r, 2),
            Enum.Parse<PartEventKind>(r.GetString(3)),
            ReadText(r, 4),
            ReadText(r, 5),
            ReadText(r, 6),
            ReadText(r, 7)
        );

    private protected RawReading ReadRawReading(DbDataReader r) =>
        new(
            r.GetInt64(0),
            r.GetInt32(1),
            ReadTime(r, 2),
            r.GetDouble(3),
            r.GetDouble(4),
            Enum.Parse<ReadingKind>(r.GetString(5))
        );

    private protected StoredDriftSample ReadDriftSample(DbDataReader r) =>
        new(r.GetInt64(0), r.GetInt32(1), ReadTime(r, 2), r.GetDouble(3), ReadDouble(r, 4));

    private protected Task<PartRecord?> GetPartCoreAsync(
        DbScope scope,
        long partId,
        CancellationToken cancellationToken
    ) =>
        scope
            .Sql($"SELECT {PartColumns} FROM parts p WHERE p.id = @id")
            .With("id", partId)
            .FirstOrDefaultAsync(ReadPart, cancellationToken);

    private protected Task<SessionInfo?> GetSessionCoreAsync(
        DbScope scope,
        long sessionId,
        CancellationToken cancellationToken
    ) =>
        scope
            .Sql($"SELECT {SessionColumns} FROM sessions s WHERE s.id = @id")
            .With("id", sessionId)
            .FirstOrDefaultAsync(ReadSession, cancellationToken);

    private protected Task<BatchInfo?> GetBatchCoreAsync(
        DbScope scope,
        long batchId,
        CancellationToken cancellationToken
    ) =>
        scope
            .Sql($"SELECT {BatchColumns} FROM batches b WHERE b.id = @id")
            .With("id", batchId)
            .FirstOrDefaultAsync(ReadBatch, cancellationToken);
}
