namespace SortRig.Engine.Events;

/// <summary>
/// One subscriber's queue of bench events. Past <see cref="Capacity"/> it drops its oldest live reading (a newer one
/// says more), never an announcement, a count, a notice or the end of the session: a subscriber that reads slowly
/// (a terminal over a slow link) shows every cup, late rather than never. Only when the queue holds nothing but
/// events that must arrive does it grow past its capacity. Thread-safe for one writer at a time and one reader.
/// </summary>
internal sealed class SubscriberQueue
{
    private readonly Lock _gate = new();
    private readonly LinkedList<BenchEvent> _events = new();
    private readonly SemaphoreSlim _ready = new(0);
    private int _readings;

    public SubscriberQueue(int capacity)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(capacity, 1);
        Capacity = capacity;
    }

    /// <summary>Events kept before live readings start to be dropped.</summary>
    public int Capacity { get; }

    /// <summary>Live readings dropped so far.</summary>
    public int Dropped { get; private set; }

    /// <summary>Events waiting to be read.</summary>
    public int Count
    {
        get
        {
            lock (_gate)
            {
                return _events.Count;
            }
        }
    }

    /// <summary>True for the events a reader may miss: live readings and drift samples, superseded by the next
    /// one.</summary>
    public static bool MayDrop(BenchEvent e) => e.Kind is BenchEventKind.Reading or BenchEventKind.Drift;

    public void Write(BenchEvent e)
    {
        lock (_gate)
        {
            _events.AddLast(e);
            _readings += MayDrop(e) ? 1 : 0;
            if (_events.Count > Capacity && _readings > 0)
            {
                var oldest = _events.First;
                while (!MayDrop(oldest!.Value))
                {
                    oldest = oldest.Next;
                }

                _events.Remove(oldest);
                _readings--;
                Dropped++;
            }
            else
            {
                _ready.Release();
                return;
            }
        }

        // One event in, one out: the count of waiting events is unchanged, so no release.
    }

    public async ValueTask<BenchEvent> ReadAsync(CancellationToken cancellationToken)
    {
        await _ready.WaitAsync(cancellationToken).ConfigureAwait(false);
        lock (_gate)
        {
            var e = _events.First!.Value;
            _events.RemoveFirst();
            _readings -= MayDrop(e) ? 1 : 0;
            return e;
        }
    }
}
