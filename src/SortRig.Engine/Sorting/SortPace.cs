namespace SortRig.Engine.Sorting;

/// <summary>
/// How fast a session accepted parts, measured from its first accepted part to its last: the mean time between
/// consecutive acceptances. The wait for the first part (start-up, the first insertion) is left out, so two runs
/// compare on the settle and handling time per part alone.
/// </summary>
/// <param name="Parts">Accepted parts counted.</param>
/// <param name="Span">From the first acceptance to the last; zero with fewer than two parts.</param>
public readonly record struct SortPace(int Parts, TimeSpan Span)
{
    /// <summary>Mean seconds between consecutive acceptances, Span / (Parts − 1); null with fewer than two
    /// parts.</summary>
    public double? SecondsPerPart => Parts >= 2 ? Span.TotalSeconds / (Parts - 1) : null;

    /// <summary>3600 / <see cref="SecondsPerPart"/>; null with fewer than two parts or a zero span.</summary>
    public double? PartsPerHour => SecondsPerPart is > 0 and var s ? 3600 / s : null;

    /// <summary>The pace of parts accepted at the given times (any order).</summary>
    public static SortPace From(IEnumerable<DateTimeOffset> acceptedAt)
    {
        ArgumentNullException.ThrowIfNull(acceptedAt);
        int n = 0;
        DateTimeOffset first = DateTimeOffset.MaxValue,
            last = DateTimeOffset.MinValue;
        foreach (var t in acceptedAt)
        {
            n++;
            first = t < first ? t : first;
            last = t > last ? t : last;
        }

        return new SortPace(n, n >= 2 ? last - first : TimeSpan.Zero);
    }
}
