namespace SortRig.Measurement.Control;

/// <summary>One session's apparent meter gain against the check's calibrated value.</summary>
/// <param name="Session">Session name or id, for the table.</param>
/// <param name="At">When the session's checks were read (the first of them).</param>
/// <param name="GainPpm">Mean of (reading / calibrated - 1) · 1e6 over the session's checks, before any
/// re-reference.</param>
/// <param name="Checks">Check readings the mean is taken over.</param>
public sealed record SessionGain(string Session, DateTimeOffset At, double GainPpm, int Checks);

/// <summary>A session's gain with the meter-health verdict.</summary>
/// <param name="Gain">The session's apparent gain.</param>
/// <param name="MovedPpm">Change since the first session in the list, ppm.</param>
/// <param name="AllowedPpm">What the meter's one-year specification allows at the check's value, ppm.</param>
/// <param name="Warning">Plain words when the meter moved more than allowed, else null.</param>
public sealed record MeterHealthRow(SessionGain Gain, double MovedPpm, double AllowedPpm, string? Warning);

/// <summary>
/// Meter health across sessions: how far the apparent gain has moved from the first session, against the
/// movement the meter's one-year specification allows (its reading term plus its range term at the check's
/// value, common practice, no source: a meter within its one-year specification may move that much between
/// calibrations).
/// </summary>
public static class MeterHealth
{
    /// <summary>One row per session, oldest first.</summary>
    /// <param name="gains">Sessions' gains, any order.</param>
    /// <param name="allowedPpm">Allowed movement, ppm; finite and &gt; 0.</param>
    public static IReadOnlyList<MeterHealthRow> Judge(IEnumerable<SessionGain> gains, double allowedPpm)
    {
        ArgumentNullException.ThrowIfNull(gains);
        if (!double.IsFinite(allowedPpm) || allowedPpm <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(allowedPpm), allowedPpm, "allowedPpm must be finite and > 0.");
        }

        var ordered = gains.OrderBy(g => g.At).ToList();
        if (ordered.Count == 0)
        {
            return [];
        }

        double first = ordered[0].GainPpm;
        return ordered
            .Select(g =>
            {
                double moved = g.GainPpm - first;
                string since = ordered[0].Session;
                string? warning =
                    Math.Abs(moved) > allowedPpm
                        ? FormattableString.Invariant(
                            $"the meter moved {moved:+0.0;-0.0} ppm since {since}, more than the {allowedPpm:0.0} ppm "
                        ) + "its one-year specification allows: have it calibrated"
                        : null;
                return new MeterHealthRow(g, moved, allowedPpm, warning);
            })
            .ToList();
    }

    /// <summary>The movement a one-year specification allows at a value, ppm: reading term + range term · range /
    /// value.</summary>
    /// <param name="readingPct">One-year accuracy, % of reading.</param>
    /// <param name="rangePct">One-year accuracy, % of range.</param>
    /// <param name="rangeOhms">Range full scale, ohms.</param>
    /// <param name="valueOhms">The check's value, ohms; &gt; 0.</param>
    public static double AllowedPpm(double readingPct, double rangePct, double rangeOhms, double valueOhms)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(valueOhms);
        return (readingPct + (rangePct * rangeOhms / valueOhms)) * 1e4;
    }
}
