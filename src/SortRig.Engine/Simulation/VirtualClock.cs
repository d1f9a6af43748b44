using SortRig.Engine.DriftLogging;

namespace SortRig.Engine.Simulation;

/// <summary>
/// A clock that moves only when told: <see cref="DriveAsync"/> jumps it to the earliest pending timer whenever
/// one is waiting, so a 12-hour drift run on the embedded simulator takes as long as its I/O, not 12 hours.
/// Only sound when every timer on this clock marks progress (reading apertures, scan intervals, back-off):
/// link timeouts must run on the system clock (<see cref="DriftServices.LinkTime"/>).
/// A virtual operator gets its own view (<see cref="OperatorView"/>): its timers (handling, reaction, dwell) fire
/// only while a timer of the meter or the session is also pending, that is while the session waits on this clock
/// (a reading's aperture, a back-off), never while it is busy with a reply in flight; otherwise the operator would
/// act "instantly" between two readings. When nothing else happens for <see cref="OperatorGrace"/> of real time (the
/// session waits on the operator, e.g. for a bridging part) the operator's timer fires anyway if it lies within
/// <see cref="OperatorReach"/>.
/// </summary>
public sealed class VirtualClock : TimeProvider
{
    private readonly Lock _gate = new();
    private readonly List<Timer> _pending = [];
    private readonly SemaphoreSlim _changed = new(0);
    private DateTimeOffset _now;
    private long _sequence;
    private long _changedAt = Environment.TickCount64;

    /// <summary>Creates the clock at <paramref name="start"/>.</summary>
    public VirtualClock(DateTimeOffset start)
    {
        _now = start;
        OperatorView = new OperatorClock(this);
    }

    /// <summary>Real time with nothing scheduled or fired after which an operator's timer fires alone; default
    /// 1 s.</summary>
    public TimeSpan OperatorGrace { get; init; } = TimeSpan.FromSeconds(1);

    /// <summary>How far ahead an operator's timer may lie to fire alone after <see cref="OperatorGrace"/>; default
    /// 1 min.
    /// A person's handling and reaction take seconds; a longer wait (the operator's patience with a part that is never
    /// announced) fires only when the session's own waits reach it.</summary>
    public TimeSpan OperatorReach { get; init; } = TimeSpan.FromMinutes(1);

    /// <summary>The same clock for a virtual operator: see the class remarks.</summary>
    public TimeProvider OperatorView { get; }

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
    public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period) =>
        Create(callback, state, dueTime, period, byOperator: false);

    /// <summary>Drives <paramref name="work"/> to completion, jumping to each pending timer in turn.</summary>
    /// <param name="work">The task that waits on this clock.</param>
    /// <param name="beforeJump">Called with the time about to be reached, before each forward jump (e.g. to sample
    /// memory).</param>
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

    /// <summary>
    /// Moves the clock forward to <paramref name="instant"/> at once, firing in order the timers due by then (a harness
    /// that samples at chosen instants, e.g. the settle benchmark). The clock never runs backwards.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="instant"/> is before now.</exception>
    public void MoveTo(DateTimeOffset instant)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(instant, GetUtcNow());
        while (true)
        {
            Timer next;
            lock (_gate)
            {
                var due = _pending.Where(t => t.Due <= instant).MinBy(t => (t.Due, t.Sequence));
                if (due is null)
                {
                    _now = instant;
                    return;
                }

                next = due;
                _pending.Remove(next);
                _now = next.Due > _now ? next.Due : _now;
                if (next.Period > TimeSpan.Zero)
                {
                    Schedule(next, _now + next.Period, next.Period);
                }
            }

            next.Fire();
        }
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
            var quiet = Environment.TickCount64 - _changedAt >= (long)OperatorGrace.TotalMilliseconds;
            var operatorAlone = next.ByOperator && _pending.TrueForAll(t => t.ByOperator);
            if (operatorAlone && (!quiet || next.Due - _now > OperatorReach))
            {
                return false; // the session is busy (a reply in flight, a commit): the operator waits for it
            }
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
        lock (_gate)
        {
            _changedAt = Environment.TickCount64;
        }

        return true;
    }

    private Timer Create(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period, bool byOperator)
    {
        var timer = new Timer(this, callback, state) { ByOperator = byOperator };
        timer.Change(dueTime, period);
        return timer;
    }

    private void Schedule(Timer timer, DateTimeOffset? due, TimeSpan period)
    {
        lock (_gate)
        {
            _changedAt = Environment.TickCount64;
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

        public bool ByOperator { get; init; }

        public void Fire() => callback(state);

        public bool Change(TimeSpan dueTime, TimeSpan period)
        {
            var finite = dueTime != Timeout.InfiniteTimeSpan;
            var repeat = period == Timeout.InfiniteTimeSpan ? TimeSpan.Zero : period;
            clock.Schedule(
                this,
                finite ? clock.GetUtcNow() + (dueTime < TimeSpan.Zero ? TimeSpan.Zero : dueTime) : null,
                repeat
            );
            return true;
        }

        public void Dispose() => clock.Schedule(this, null, TimeSpan.Zero);

        public ValueTask DisposeAsync()
        {
            Dispose();
            return ValueTask.CompletedTask;
        }
    }

    private sealed class OperatorClock(VirtualClock clock) : TimeProvider
    {
        public override long TimestampFrequency => clock.TimestampFrequency;

        public override DateTimeOffset GetUtcNow() => clock.GetUtcNow();

        public override long GetTimestamp() => clock.GetTimestamp();

        public override ITimer CreateTimer(TimerCallback callback, object? state, TimeSpan dueTime, TimeSpan period) =>
            clock.Create(callback, state, dueTime, period, byOperator: true);
    }
}
