namespace SortRig.Engine.Events;

/// <summary>
/// Fan-out of bench events to any number of subscribers (console view, web page streams).
/// Each subscriber has its own queue (<see cref="SubscriberQueue"/>); a slow subscriber loses its oldest
/// live readings, never an announcement and never the producer's time. The last events are kept so a late
/// subscriber can catch up.
/// </summary>
public sealed class BenchEventHub
{
    private const int SubscriberCapacity = 4096;
    private const int HistoryCapacity = 512;
    private readonly Lock _gate = new();
    private readonly List<SubscriberQueue> _subscribers = [];
    private readonly Queue<BenchEvent> _history = new();
    private readonly TimeProvider _time;
    private long _sequence;

    public BenchEventHub(TimeProvider time) => _time = time;

    /// <summary>Publishes an event built from the template; the hub stamps sequence and time.</summary>
    public BenchEvent Publish(BenchEvent template)
    {
        lock (_gate)
        {
            var stamped = template with { Sequence = ++_sequence, Time = _time.GetUtcNow() };
            _history.Enqueue(stamped);
            while (_history.Count > HistoryCapacity)
            {
                _history.Dequeue();
            }

            foreach (var subscriber in _subscribers)
            {
                subscriber.Write(stamped);
            }

            return stamped;
        }
    }

    /// <summary>Events kept for late subscribers, oldest first.</summary>
    public IReadOnlyList<BenchEvent> History()
    {
        lock (_gate)
        {
            return [.. _history];
        }
    }

    /// <summary>Streams events published after the call (and, if asked, the kept history first).</summary>
    public async IAsyncEnumerable<BenchEvent> SubscribeAsync(
        bool includeHistory,
        [System.Runtime.CompilerServices.EnumeratorCancellation] CancellationToken cancellationToken
    )
    {
        var queue = new SubscriberQueue(SubscriberCapacity);
        lock (_gate)
        {
            if (includeHistory)
            {
                foreach (var e in _history)
                {
                    queue.Write(e);
                }
            }

            _subscribers.Add(queue);
        }

        try
        {
            while (true)
            {
                yield return await queue.ReadAsync(cancellationToken).ConfigureAwait(false);
            }
        }
        finally
        {
            lock (_gate)
            {
                _subscribers.Remove(queue);
            }
        }
    }
}
