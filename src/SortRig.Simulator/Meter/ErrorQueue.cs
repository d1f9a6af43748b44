namespace SortRig.Simulator.Meter;

/// <summary>
/// The SCPI error queue, first in first out, <see cref="Capacity"/> entries. When an error arrives
/// at a full queue, the newest entry is replaced by -350 "Queue overflow" and the new error is lost
/// (SCPI-99 vol. 2 sec. 21.8.4).
/// </summary>
internal sealed class ErrorQueue
{
    /// <summary>Entries held (our own choice; SCPI-99 leaves the length to the device).</summary>
    public const int Capacity = 16;

    private readonly List<ScpiError> _entries = [];
    private readonly Lock _gate = new();

    public int Count
    {
        get
        {
            lock (_gate)
            {
                return _entries.Count;
            }
        }
    }

    public void Push(ScpiError error)
    {
        lock (_gate)
        {
            if (_entries.Count < Capacity)
            {
                _entries.Add(error);
            }
            else
            {
                _entries[^1] = ScpiError.QueueOverflow;
            }
        }
    }

    /// <summary>Oldest error, removed from the queue, or 0 "No error" when empty.</summary>
    public ScpiError Next()
    {
        lock (_gate)
        {
            if (_entries.Count == 0)
            {
                return ScpiError.None;
            }

            var error = _entries[0];
            _entries.RemoveAt(0);
            return error;
        }
    }

    public void Clear()
    {
        lock (_gate)
        {
            _entries.Clear();
        }
    }
}
