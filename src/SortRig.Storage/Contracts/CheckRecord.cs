namespace SortRig.Storage.Contracts;

/// <summary>A stored reading of a check standard (schema version 5).</summary>
/// <param name="Id">Row id.</param>
/// <param name="Seq">Check number within the session, from 1, contiguous.</param>
/// <param name="AfterPartNumber">The highest part number of the session when the check was read (0 before any
/// part).</param>
/// <param name="FlaggedCount">Parts this check put under suspicion (0 when in control).</param>
/// <param name="Commit">What was written.</param>
public sealed record CheckRecord(long Id, int Seq, int AfterPartNumber, int FlaggedCount, CheckCommit Commit)
{
    /// <summary>The meter's apparent gain against the calibrated value, ppm: (value / calibrated - 1) · 1e6; null when
    /// the check has no calibrated value.</summary>
    public double? GainPpm => Commit.CalibratedOhms is { } c ? ((Commit.ValueOhms / c) - 1) * 1e6 : null;
}
