using SortRig.Instruments.Scpi;

namespace SortRig.Instruments.Drivers;

/// <summary>
/// Reading replies in a row that were not a reading (<see cref="ScpiResponseException"/>: a garbled reply or the
/// not-a-number value). Each one waits longer before the next request (<see cref="Backoff"/>), and
/// <see cref="Limit"/> in a row stop the job (<see cref="MeterUnreadableException"/>) instead of asking forever.
/// A good reading starts the count again. Not thread-safe: one job owns it.
/// </summary>
public sealed class UnreadableStreak
{
    /// <summary>
    /// Unreadable replies in a row that stop a job: 12, about 38 s of requests with the sort's back-off
    /// (0.25 s doubling to 5 s). A garbled line now and then never gets there; a meter that only answers
    /// not-a-number (wrong function, a reading it cannot make) does.
    /// </summary>
    public const int DefaultLimit = 12;

    private readonly Backoff _backoff;
    private TimeSpan _wait;

    /// <param name="backoff">Waits between unreadable replies.</param>
    /// <param name="limit">Unreadable replies in a row that stop the job; at least 1.</param>
    public UnreadableStreak(Backoff backoff, int limit = DefaultLimit)
    {
        ArgumentNullException.ThrowIfNull(backoff);
        ArgumentOutOfRangeException.ThrowIfLessThan(limit, 1);
        (_backoff, Limit) = (backoff, limit);
    }

    /// <summary>Unreadable replies in a row that stop the job.</summary>
    public int Limit { get; }

    /// <summary>Unreadable replies since the last good reading.</summary>
    public int Count { get; private set; }

    /// <summary>A good reading: the count starts again.</summary>
    public void Reset() => (Count, _wait) = (0, TimeSpan.Zero);

    /// <summary>
    /// Counts one unreadable reply and returns the wait before the next request; the <see cref="Limit"/>-th in a
    /// row throws <see cref="MeterUnreadableException"/> naming the reply.
    /// </summary>
    public TimeSpan Note(ScpiResponseException reply)
    {
        ArgumentNullException.ThrowIfNull(reply);
        Count++;
        if (Count >= Limit)
        {
            throw new MeterUnreadableException(Count, reply.Reply, reply);
        }

        _wait = _wait == TimeSpan.Zero ? _backoff.First : _backoff.Next(_wait);
        return _wait;
    }
}
