using SortRig.Engine.DriftLogging;

namespace SortRig.Engine.Simulation;

/// <summary>
/// A clock that moves only when told: <see cref="DriveAsync"/> jumps it to the earliest pending timer whenever
/// one is waiting, so a 12-hour drift run on the embedded simulator takes as long as its I/O, not 12 hours.
/// Only sound when every timer on this clock marks progress (reading apertures, scan intervals, back-off):
/// link timeouts must run on the system clock (<see cref="DriftServices.LinkTime"/>).
/// </summary>
public sealed class VirtualClock : TimeProvider
{
    private readonly Lock _gate = new();
    private readonly List<Timer> _pending = [];
    private readonly SemaphoreSlim _changed = new(0);
    private DateTimeOffset _now;
    private long _sequence;

    /// <summary>Creates the clock at <paramref name="start"/>.</summary>
    public VirtualClock(DateTimeOffset start) => _now = start;

    /// <inheritdoc />
    public override long TimestampFrequency => TimeSpan.TicksPerSecond;

    /// <inheritdoc />
    public override DateTimeOffset GetUtcNow()
    {
        lock (_gate)
        {
            return _now;
        }
    }

    /// <inheritdoc />
    public override long GetTimestamp() => GetUtcNow().UtcTicks;

    /// <inheritdoc />
    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period)
    {
        var timer = new Timer(this, callback, state);
        timer.Change(dueTime, period);
        return timer;
    }

    /// <summary>Drives <paramref name="work"/> to completion, jumping to each pending timer in turn.</summary>
    /// <param name="work">The task that waits on this clock.</param>
    /// <param name="beforeJump">Called with the time about to be reached, before each forward jump (e.g. to sample memory).</param>
    /// <param name="ct">Stops driving (the work is not cancelled).</param>
    public async Task DriveAsync(Task work, Action<DateTimeOffset>? beforeJump, CancellationToken ct)
    {
        ArgumentNullException.ThrowIfNull(work);
        while (!work.IsCompleted)
        {
            if (!FireNext(beforeJump))
            {
                // Nothing to wait for on this clock: real I/O is in flight. Wake on a new timer or poll.
                await _changed.WaitAsync(TimeSpan.FromMilliseconds(20), ct).ConfigureAwait(false);
            }
        }

        await work.ConfigureAwait(false);
    }

    private bool FireNext(Action<DateTimeOffset>? beforeJump)
    {
        Timer next;
        lock (_gate)
        {
            if (_pending.Count == 0)
            {
                return false;
            }

            next = _pending.MinBy(t => (t.Due, t.Sequence))!;
        }

        if (next.Due > _now)
        {
            beforeJump?.Invoke(next.Due);
        }

        lock (_gate)
        {
            if (!_pending.Remove(next))
            {
                return true; // changed or disposed meanwhile: look again
            }

            _now = next.Due > _now ? next.Due : _now;
            if (next.Period > TimeSpan.Zero)
            {
                Schedule(next, _now + next.Period, next.Period);
            }
        }

        next.Fire();
        return true;
    }

    private void Schedule(Timer timer, DateTimeOffset? due, TimeSpan period)
    {
        lock (_gate)
        {
            _pending.Remove(timer);
            if (due is { } d)
            {
                (timer.Due, timer.Period, timer.Sequence) = (d, period, ++_sequence);
                _pending.Add(timer);
            }
        }

        if (_changed.CurrentCount == 0)
        {
            _changed.Release(); // one wake-up is enough; the driver looks at every pending timer
        }
    }

    private sealed class Timer(VirtualClock clock, TimerCallback callback, object? state) : ITimer
    {
        public DateTimeOffset Due { get; set; }

        public TimeSpan Period { get; set; }

        public long Sequence { get; set; }

        public void Fire() => callback(state);

        public bool Change(TimeSpan dueTime, TimeSpan period)
        {
            var finite = dueTime != Timeout.InfiniteTimeSpan;
            var repeat = period == Timeout.InfiniteTimeSpan ? TimeSpan.Zero : period;
            clock.Schedule(this, finite ? clock.GetUtcNow() + (dueTime < TimeSpan.Zero ? TimeSpan.Zero : dueTime) : null, repeat);
            return true;
        }

        public void Dispose() => clock.Schedule(this, null, TimeSpan.Zero);

        public ValueTask DisposeAsync()
        {
            Dispose();
            return ValueTask.CompletedTask;
        }
    }
}
