namespace SortRig.Storage.Contracts;

/// <summary>A batch of parts of one nominal value measured with one meter setup, as stored.</summary>
/// <param name="Id">Database id.</param>
/// <param name="SessionId">Owning session.</param>
/// <param name="StartedAt">When the batch was started (UTC).</param>
/// <param name="Setup">The measurement setup given when the batch was started.</param>
/// <param name="RangeTransfer">Correction between two ranges, once recorded; null until then.</param>
/// <param name="ReelPrior">What the predictive settle rule had learned of the batch's reel after its latest part
/// (schema version 7, <see cref="PartCommit.ReelPrior"/>); null before the first part that carried one. A resumed
/// session goes on from it.</param>
public sealed record BatchInfo(
    long Id,
    long SessionId,
    DateTimeOffset StartedAt,
    BatchSetup Setup,
    RangeTransferCorrection? RangeTransfer,
    SortRig.Measurement.Settling.ReelPrior? ReelPrior = null
);

/// <summary>The measurement setup of a batch. Checked by <see cref="ISessionLog.StartBatchAsync"/>.</summary>
/// <param name="Nominal">Nominal value, ohms, &gt; 0.</param>
/// <param name="StockTolerancePpm">Tolerance printed on the parts, ppm of nominal, &gt; 0 (1 % = 10 000 ppm).</param>
/// <param name="MatchTolerancePpm">Matching tolerance wanted, ppm, &gt; 0 (0.1 % = 1 000 ppm).</param>
/// <param name="Range">Meter range full scale, ohms, &gt; 0.</param>
/// <param name="Nplc">Integration time in power-line cycles, &gt; 0.</param>
/// <param name="FourWire">True for a four-wire (Kelvin) measurement.</param>
/// <param name="MeterFamily">Meter profile family name, non-empty.</param>
/// <param name="MeterIdentity">The meter's *IDN? answer (IEEE 488.2), non-empty.</param>
/// <param name="RecipeName">Name of the recipe the batch follows, optional.</param>
public sealed record BatchSetup(
    double Nominal,
    double StockTolerancePpm,
    double MatchTolerancePpm,
    double Range,
    double Nplc,
    bool FourWire,
    string MeterFamily,
    string MeterIdentity,
    string? RecipeName = null
);

/// <summary>
/// A range-transfer correction: the ratio error between two meter ranges, measured with one part read on
/// both, applied to values taken on <see cref="FromRange"/> to bring them onto <see cref="ToRange"/>.
/// </summary>
/// <param name="FromRange">Range whose readings are corrected, ohms, &gt; 0.</param>
/// <param name="ToRange">Reference range, ohms, &gt; 0.</param>
/// <param name="CorrectionPpm">Correction to add, ppm of value (any finite value).</param>
/// <param name="StandardUncertaintyPpm">Standard uncertainty of the correction, ppm, &gt;= 0.</param>
/// <param name="MeasuredAt">When the transfer was measured.</param>
public sealed record RangeTransferCorrection(
    double FromRange,
    double ToRange,
    double CorrectionPpm,
    double StandardUncertaintyPpm,
    DateTimeOffset MeasuredAt
);
