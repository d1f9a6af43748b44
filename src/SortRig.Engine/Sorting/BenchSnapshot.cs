namespace SortRig.Engine.Sorting;

/// <summary>
/// The current state of the bench, kept by the sorting loop for readers (web API, live view).
/// Thread-safe; readers get immutable copies. The precision log stays the durable record.
/// </summary>
public sealed class BenchSnapshot
{
    private readonly Lock _gate = new();
    private readonly List<PartView> _parts = [];
    private SessionView? _session;
    private SortRig.Engine.Checking.CheckView? _check;
    private IReadOnlyDictionary<string, int> _counts = new Dictionary<string, int>();

    /// <summary>The session, or null before one is open.</summary>
    public SessionView? Session
    {
        get
        {
            lock (_gate)
            {
                return _session;
            }
        }
    }

    /// <summary>The last check of the check standard, or null when the session has no check (or none yet).</summary>
    public SortRig.Engine.Checking.CheckView? LastCheck
    {
        get
        {
            lock (_gate)
            {
                return _check;
            }
        }
    }

    /// <summary>Cup label to count of parts currently in it.</summary>
    public IReadOnlyDictionary<string, int> Counts
    {
        get
        {
            lock (_gate)
            {
                return _counts;
            }
        }
    }

    /// <summary>Parts in number order.</summary>
    public IReadOnlyList<PartView> Parts()
    {
        lock (_gate)
        {
            return [.. _parts];
        }
    }

    internal void SetCheck(SortRig.Engine.Checking.CheckView check)
    {
        lock (_gate)
        {
            _check = check;
        }
    }

    internal void SetSession(SessionView session)
    {
        lock (_gate)
        {
            _session = session;
        }
    }

    internal void UpdateSession(Func<SessionView, SessionView> change)
    {
        lock (_gate)
        {
            if (_session is not null)
            {
                _session = change(_session);
            }
        }
    }

    internal void SetCounts(IReadOnlyDictionary<string, int> counts)
    {
        lock (_gate)
        {
            _counts = counts;
        }
    }

    internal void Upsert(PartView part)
    {
        lock (_gate)
        {
            var i = _parts.FindIndex(p => p.Number == part.Number);
            if (i >= 0)
            {
                _parts[i] = part;
            }
            else
            {
                _parts.Add(part);
            }
        }
    }
}
