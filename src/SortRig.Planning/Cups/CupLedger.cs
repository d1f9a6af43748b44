namespace SortRig.Planning.Cups;

/// <summary>Which part is in which cup; counts per (nominal, label). Guards against placing a part twice.</summary>
internal sealed class CupLedger
{
    private readonly Dictionary<long, (CupRequest Part, string Label, double Key)> _parts = [];
    private readonly Dictionary<(double Nominal, string Label), int> _counts = [];

    public int Count(double nominal, string label) => _counts.GetValueOrDefault((nominal, label));

    public IEnumerable<((double Nominal, string Label) Key, int Count)> NonEmpty =>
        _counts.Where(kv => kv.Value > 0).Select(kv => (kv.Key, kv.Value));

    /// <summary>The cup label of a part, or null when it is in no cup.</summary>
    public string? LabelOf(long partNumber) => _parts.TryGetValue(partNumber, out var at) ? at.Label : null;

    public void EnsureNew(long partNumber)
    {
        if (_parts.TryGetValue(partNumber, out var at))
        {
            throw new InvalidOperationException(
                $"part {partNumber} is already in cup {at.Label}; undo it before assigning it again"
            );
        }
    }

    /// <summary>Records the part; returns the cup's new count.</summary>
    public int Add(CupRequest part, double nominalKey, string label)
    {
        EnsureNew(part.PartNumber);
        _parts[part.PartNumber] = (part, label, nominalKey);
        var key = (nominalKey, label);
        _counts[key] = _counts.GetValueOrDefault(key) + 1;
        return _counts[key];
    }

    public (CupRequest Part, string Label, double Key) Remove(long partNumber)
    {
        if (!_parts.Remove(partNumber, out var entry))
        {
            throw new InvalidOperationException($"part {partNumber} is in no cup");
        }

        _counts[(entry.Key, entry.Label)]--;
        return entry;
    }

    public void Clear()
    {
        _parts.Clear();
        _counts.Clear();
    }
}
