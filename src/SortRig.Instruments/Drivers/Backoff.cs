namespace SortRig.Instruments.Drivers;

/// <summary>Doubling back-off between reconnect attempts.</summary>
/// <param name="First">Wait after the first failure; must be positive.</param>
/// <param name="Last">Longest wait; the doubling stops here. Must be at least <paramref name="First"/>.</param>
public sealed record Backoff(TimeSpan First, TimeSpan Last)
{
    /// <summary>The wait after <paramref name="current"/>: twice as long, at most <see cref="Last"/>.</summary>
    public TimeSpan Next(TimeSpan current) => TimeSpan.FromTicks(Math.Min(Last.Ticks, current.Ticks * 2));
}
