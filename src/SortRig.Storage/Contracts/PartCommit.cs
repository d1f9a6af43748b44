using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Storage.Contracts;

/// <summary>
/// A part to commit: the accepted value and every raw reading behind it, written in one transaction.
/// The part number is allocated by the store inside that transaction.
/// </summary>
/// <param name="CommitKey">Client-chosen idempotency key (a fresh GUID per part, kept across retries); committing the
/// same key again returns the part stored the first time and writes nothing.</param>
/// <param name="SessionId">Open (unfinished) session.</param>
/// <param name="BatchId">Batch of that session.</param>
/// <param name="Measured">Accepted value and uncertainties, ohms; value and uncertainties finite, uncertainties &gt;=
/// 0.</param>
/// <param name="Range">Range full scale, ohms, &gt; 0.</param>
/// <param name="Nplc">Integration time, power-line cycles, &gt; 0.</param>
/// <param name="Temperature">degC, optional.</param>
/// <param name="AcceptedAt">When the value was accepted.</param>
/// <param name="CupLabel">Cup label, optional.</param>
/// <param name="SlotLabel">Slot label, optional.</param>
/// <param name="Readings">Raw readings in the order taken; may be empty; stored with their order.</param>
/// <param name="State">Accepted (default) or Unstable; other states come from corrections.</param>
/// <param name="AcceptedBy">The settle rule that accepted the part; null for an unstable part (or when not
/// known).</param>
/// <param name="Fit">The recovery fit when <paramref name="AcceptedBy"/> is Predictive (values on the meter's own
/// scale, before any range transfer); null otherwise. Its figures must be finite and its uncertainties &gt;= 0.</param>
/// <param name="ReelPrior">What the settle rule has learned of the batch's reel after this part
/// (<see cref="SortRig.Measurement.Settling.ReelPrior"/>); stored with the batch in the part's transaction
/// (<see cref="BatchInfo.ReelPrior"/>); null leaves the batch's as it was. Counts &gt;= 0, sums finite.</param>
public sealed record PartCommit(
    Guid CommitKey,
    long SessionId,
    long BatchId,
    MeasuredValue Measured,
    double Range,
    double Nplc,
    double? Temperature,
    DateTimeOffset AcceptedAt,
    string? CupLabel,
    string? SlotLabel,
    IReadOnlyList<Reading> Readings,
    PartState State = PartState.Accepted,
    SettleRule? AcceptedBy = null,
    RecoveryFit? Fit = null,
    ReelPrior? ReelPrior = null
);

/// <summary>A raw meter reading stored with its part.</summary>
/// <param name="PartId">Owning part.</param>
/// <param name="Sequence">0-based position in the order taken.</param>
/// <param name="Time">When the reading completed (UTC, microsecond resolution).</param>
/// <param name="Value">Ohms; +infinity for an overload.</param>
/// <param name="Range">Range full scale, ohms.</param>
/// <param name="Kind">Finite or overload.</param>
public sealed record RawReading(
    long PartId,
    int Sequence,
    DateTimeOffset Time,
    double Value,
    double Range,
    ReadingKind Kind
);
