namespace SortRig.Simulator;

/// <summary>
/// A clock that runs <see cref="Speed"/> times faster than an inner clock, from the moment it is
/// created: wall time, timestamps and timers all scale (a 10 s timer at speed 100 fires after 0.1 s
/// of inner time). Lets a demo or an end-to-end test run a whole reel in seconds over a real socket.
/// </summary>
public sealed class ScaledTimeProvider : TimeProvider
{
    private readonly TimeProvider _inner;
    private readonly DateTimeOffset _origin;
    private readonly long _originTimestamp;

    /// <summary>Creates a scaled clock.</summary>
    /// <param name="speed">How many times faster than <paramref name="inner"/>; above 0 and at most 10 000 (1 keeps the
    /// pace).</param>
    /// <param name="inner">The clock to scale; default <see cref="TimeProvider.System"/>.</param>
    public ScaledTimeProvider(double speed, TimeProvider? inner = null)
    {
        if (!double.IsFinite(speed) || speed <= 0 || speed > 10_000)
        {
            throw new ArgumentOutOfRangeException(
                nameof(speed),
                speed,
                $"speed must be above 0 and at most 10000; was {speed}."
            );
        }

        Speed = speed;
        _inner = inner ?? System;
        _origin = _inner.GetUtcNow();
        _originTimestamp = _inner.GetTimestamp();
    }

    /// <summary>The speed-up factor.</summary>
    public double Speed { get; }

    /// <inheritdoc />
    public override TimeZoneInfo LocalTimeZone => _inner.LocalTimeZone;

    /// <inheritdoc />
    public override long TimestampFrequency => _inner.TimestampFrequency;

    /// <inheritdoc />
    public override DateTimeOffset GetUtcNow() =>
        _origin + TimeSpan.FromTicks((long)((_inner.GetUtcNow() - _origin).Ticks * Speed));

    /// <inheritdoc />
    public override long GetTimestamp() =>
        _originTimestamp + (long)((_inner.GetTimestamp() - _originTimestamp) * Speed);

    /// <inheritdoc />
    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period) =>
        new ScaledTimer(_inner.CreateTimer(callback, state, ToInner(dueTime), ToInner(period)), this);

    /// <summary>
    /// A scaled interval in inner time, rounded up, and at least one millisecond: the system timer
    /// works in whole milliseconds and fires a shorter interval at once, which would let a
    /// simulated meter answer many times faster than its integration time at high speed-ups.
    /// </summary>
    private TimeSpan ToInner(TimeSpan scaled) =>
        scaled == Timeout.InfiniteTimeSpan || scaled <= TimeSpan.Zero
            ? scaled
            : TimeSpan.FromTicks(Math.Max(TimeSpan.TicksPerMillisecond, (long)Math.Ceiling(scaled.Ticks / Speed)));

    private sealed class ScaledTimer(ITimer inner, ScaledTimeProvider owner) : ITimer
    {
        public bool Change(TimeSpan dueTime, TimeSpan period) =>
            inner.Change(owner.ToInner(dueTime), owner.ToInner(period));

        public void Dispose() => inner.Dispose();

        public ValueTask DisposeAsync() => inner.DisposeAsync();
    }
}
