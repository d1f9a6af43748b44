namespace SortRig.Planning.Cups;

/// <summary>
/// Slot mode: every part gets its own numbered slot (lowest free first) so the offline assembler can use exact
/// values; the pick list then names slots. <see cref="CupDecision.CompletesSet"/> is always false here, because
/// sets are decided afterwards. Parts of a nominal not accepted, or arriving when every slot is full, go to "R".
/// </summary>
public sealed class SlotAssigner(SlotOptions options) : ICupAssigner
{
    private readonly CupLedger _ledger = new();
    private readonly SortedSet<int> _free = new(Enumerable.Range(0, options.Capacity));
    private readonly Dictionary<string, int> _index = Enumerable
        .Range(0, options.Capacity)
        .ToDictionary(options.Label, i => i);

    /// <inheritdoc />
    public IReadOnlyList<CupCount> Counts =>
        _ledger
            .NonEmpty.Select(e =>
                e.Key.Label == CupLabels.Reject
                    ? new CupCount(0, CupLabels.Reject, options.Capacity, true, e.Count, double.NaN, double.NaN, 0)
                    : new CupCount(
                        e.Key.Nominal,
                        e.Key.Label,
                        _index[e.Key.Label],
                        false,
                        e.Count,
                        double.NaN,
                        double.NaN,
                        0
                    )
            )
            .OrderBy(c => c.CupIndex)
            .ToList();

    /// <inheritdoc />
    public CupDecision Assign(CupRequest request)
    {
        _ledger.EnsureNew(request.PartNumber);
        if (options.Nominals is { } wanted && !wanted.Any(n => Math.Abs(n - request.Nominal) <= n * 1e-4))
        {
            _ledger.Add(request, 0, CupLabels.Reject);
            return new CupDecision(CupLabels.Reject, options.Capacity, true, "nominal not wanted in the trays", false)
            {
                IsSlot = true,
            };
        }

        if (_free.Count == 0)
        {
            _ledger.Add(request, 0, CupLabels.Reject);
            return new CupDecision(CupLabels.Reject, options.Capacity, true, "every slot is full", false)
            {
                IsSlot = true,
            };
        }

        var slot = _free.Min;
        _free.Remove(slot);
        var label = options.Label(slot);
        _ledger.Add(request, request.Nominal, label);
        return new CupDecision(label, slot, false, "own slot", false) { IsSlot = true };
    }

    /// <inheritdoc />
    public void Restore(IReadOnlyList<(CupRequest Part, string CupLabel)> history)
    {
        _ledger.Clear();
        _free.UnionWith(Enumerable.Range(0, options.Capacity));
        foreach (var (part, label) in history)
        {
            if (label == CupLabels.Reject)
            {
                _ledger.Add(part, 0, label);
                continue;
            }

            if (!_index.TryGetValue(label, out var slot) || !_free.Remove(slot))
            {
                throw new ArgumentException(
                    $"slot '{label}' of part {part.PartNumber} is unknown or already taken",
                    nameof(history)
                );
            }

            _ledger.Add(part, part.Nominal, label);
        }
    }

    /// <inheritdoc />
    public void Undo(long partNumber)
    {
        var entry = _ledger.Remove(partNumber);
        if (_index.TryGetValue(entry.Label, out var slot))
        {
            _free.Add(slot);
        }
    }
}
