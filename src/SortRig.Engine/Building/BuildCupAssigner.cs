using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;

namespace SortRig.Engine.Building;

/// <summary>
/// Wraps the session's cup assigner for a build: a part that cannot help the build (<see cref="PartUse"/>) goes to
/// the reject cup (the slot tray's reject bin in slot mode) instead of a cup or slot; every other part is placed as
/// before. The log keeps the reject label, so a restart restores it through the inner assigner.
/// </summary>
internal sealed class BuildCupAssigner(ICupAssigner inner, double stockTolerance, AssemblyOptions options, bool slots)
    : ICupAssigner
{
    /// <summary>The build; null places every part as the inner assigner does (set once the session's target is
    /// known).</summary>
    public BuildTarget? Target { get; set; }

    private readonly Dictionary<long, CupRequest> _turnedAway = [];

    /// <summary>Why the last part was turned away; empty when it was placed as usual.</summary>
    public string LastReason { get; private set; } = "";

    /// <inheritdoc />
    public IReadOnlyList<CupCount> Counts
    {
        get
        {
            var counts = inner.Counts.ToList();
            if (_turnedAway.Count == 0)
            {
                return counts;
            }

            var i = counts.FindIndex(c => c.IsReject);
            if (i < 0)
            {
                counts.Add(
                    new CupCount(0, CupLabels.Reject, counts.Count, true, _turnedAway.Count, double.NaN, double.NaN, 0)
                );
            }
            else
            {
                counts[i] = counts[i] with { Count = counts[i].Count + _turnedAway.Count };
            }

            return counts;
        }
    }

    /// <inheritdoc />
    public CupDecision Assign(CupRequest request)
    {
        var use = Target is { } target
            ? PartUse.Judge(target.Recipe, request.Nominal, request.Value, stockTolerance, options)
            : new PartUse(true, "");
        LastReason = use.Reason;
        if (use.Helps)
        {
            return inner.Assign(request);
        }

        if (!_turnedAway.TryAdd(request.PartNumber, request))
        {
            throw new InvalidOperationException($"part {request.PartNumber} is already in a cup");
        }

        var index = inner.Counts.FirstOrDefault(c => c.IsReject)?.CupIndex ?? inner.Counts.Count;
        return new CupDecision(CupLabels.Reject, index, true, "cannot help the build: " + use.Reason, false)
        {
            IsSlot = slots,
        };
    }

    /// <inheritdoc />
    public void Restore(IReadOnlyList<(CupRequest Part, string CupLabel)> history)
    {
        _turnedAway.Clear();
        inner.Restore(history);
    }

    /// <inheritdoc />
    public void Undo(long partNumber)
    {
        if (!_turnedAway.Remove(partNumber))
        {
            inner.Undo(partNumber);
        }
    }
}
