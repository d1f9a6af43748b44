namespace SortRig.Engine.Tests.Reliability.Support;

/// <summary>
/// The system clock with a jump the test can make: <see cref="Step"/> moves the time of day and the
/// timestamp forward at once, as when the whole process is suspended (a stall) — timers keep their
/// own durations.
/// </summary>
internal sealed class SteppedClock : TimeProvider
{
    private long _offsetTicks;

    public void Step(TimeSpan by) => Interlocked.Add(ref _offsetTicks, by.Ticks);

    public override DateTimeOffset GetUtcNow() => System.GetUtcNow().AddTicks(Interlocked.Read(ref _offsetTicks));

    public override long GetTimestamp() =>
        System.GetTimestamp()
        + (long)(Interlocked.Read(ref _offsetTicks) * (double)System.TimestampFrequency / TimeSpan.TicksPerSecond);

    public override long TimestampFrequency => System.TimestampFrequency;

    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period) =>
        System.CreateTimer(callback, state, dueTime, period);
}
