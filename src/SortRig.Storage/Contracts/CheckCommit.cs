namespace SortRig.Storage.Contracts;

/// <summary>One reading of the session's check standard with the control chart's verdict, as the engine
/// writes it.</summary>
/// <param name="CommitKey">Idempotency key: a retried write with the same key writes nothing.</param>
/// <param name="SessionId">The session it belongs to (open).</param>
/// <param name="CheckName">Which check part, e.g. "library:41", "channel:3", "fixture:ref-10k"; non-empty.</param>
/// <param name="At">When the reading settled (UTC).</param>
/// <param name="ValueOhms">The settled value, ohms; finite and &gt; 0.</param>
/// <param name="RangeOhms">The meter range, ohms; &gt; 0.</param>
/// <param name="UStandardOhms">Standard uncertainty of the value, ohms; &gt;= 0.</param>
/// <param name="CalibratedOhms">The check's calibrated value, ohms, when known (for the meter's apparent gain).</param>
/// <param name="CentreOhms">Centre line of the chart it was judged on, ohms, when limits existed.</param>
/// <param name="SigmaOhms">Sigma of the chart, ohms, when limits existed.</param>
/// <param name="InControl">The chart's verdict.</param>
/// <param name="Rule">The rule that fired ("None" when in control); non-empty.</param>
/// <param name="Reason">Plain words when out of control.</param>
/// <param name="ScaleFactor">The factor the session multiplied the meter's values by when the check was read (1 until
/// the session re-referenced to the check after a shift); &gt; 0. The chart judges <c>ValueOhms ·
/// ScaleFactor</c>.</param>
public sealed record CheckCommit(
    Guid CommitKey,
    long SessionId,
    string CheckName,
    DateTimeOffset At,
    double ValueOhms,
    double RangeOhms,
    double UStandardOhms,
    double? CalibratedOhms,
    double? CentreOhms,
    double? SigmaOhms,
    bool InControl,
    string Rule,
    string? Reason,
    double ScaleFactor = 1
)
{
    /// <summary>The value on the session's reference scale, ohms: <c>ValueOhms · ScaleFactor</c>.</summary>
    public double ScaledOhms => ValueOhms * ScaleFactor;
}
