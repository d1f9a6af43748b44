using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Storage.Contracts;

/// <summary>One measured part as stored in the precision log.</summary>
/// <param name="Id">Database id, unique across sessions.</param>
/// <param name="CommitKey">The client key that made the commit idempotent.</param>
/// <param name="SessionId">Owning session.</param>
/// <param name="BatchId">Batch the part was measured in.</param>
/// <param name="Number">Part number within the session, contiguous from 1.</param>
/// <param name="Nominal">Nominal value of the batch, ohms.</param>
/// <param name="Measured">Accepted value with standard and transfer uncertainty (ohms) and coverage factor.</param>
/// <param name="Range">Range full scale the value was taken on, ohms.</param>
/// <param name="Nplc">Integration time, power-line cycles.</param>
/// <param name="Temperature">Ambient or part temperature at acceptance, degC; null when not measured.</param>
/// <param name="AcceptedAt">When the value was accepted (UTC, microsecond resolution).</param>
/// <param name="CupLabel">Cup the part went into; null when it went to a slot or nowhere.</param>
/// <param name="SlotLabel">Storage slot label (e.g. a tray position); null when not slotted.</param>
/// <param name="State">Session state of the part.</param>
/// <param name="Announced">True once the host announced the part's cup to the operator.</param>
/// <param name="Location">Library storage location (shelf, box); null until set.</param>
/// <param name="LibraryStatus">Library status; Available when committed.</param>
/// <param name="TakenBy">Who took the part (kept after Used); null when never taken or released.</param>
/// <param name="AcceptedBy">The settle rule that accepted the part; null for unstable parts and parts logged before
/// schema version 3.</param>
/// <param name="Fit">The predictive rule's recovery fit when <paramref name="AcceptedBy"/> is Predictive (meter scale,
/// before any range transfer); null otherwise. <see cref="RecoveryFit.RunsZ"/> reads back NaN when it was not
/// finite.</param>
/// <param name="ReplacedBy">Id of the record that measured this part again (schema version 6); null when the part was
/// not measured again, or was measured again by an undo without a new record.</param>
/// <param name="Suspect">True while a check out of control has flagged the part and it has not been measured again:
/// it stays out of planning, picking and the library.</param>
public sealed record PartRecord(
    long Id,
    Guid CommitKey,
    long SessionId,
    long BatchId,
    int Number,
    double Nominal,
    MeasuredValue Measured,
    double Range,
    double Nplc,
    double? Temperature,
    DateTimeOffset AcceptedAt,
    string? CupLabel,
    string? SlotLabel,
    PartState State,
    bool Announced,
    string? Location,
    LibraryStatus LibraryStatus,
    string? TakenBy,
    SettleRule? AcceptedBy = null,
    RecoveryFit? Fit = null,
    long? ReplacedBy = null,
    bool Suspect = false
)
{
    /// <summary>Accepted value, ohms.</summary>
    public double Value => Measured.Value;

    /// <summary>Deviation from nominal, ppm: (value - nominal) / nominal * 1e6.</summary>
    public double DeviationPpm => (Measured.Value - Nominal) / Nominal * 1e6;

    /// <summary>True while the part sits in its cup (Accepted or Announced).</summary>
    public bool IsLive => State is PartState.Accepted or PartState.Announced;
}
