namespace SortRig.Simulator.Faults;

/// <summary>How many faults of each kind were actually injected. Thread-safe.</summary>
public sealed class FaultLog
{
    private readonly int[] _counts = new int[Enum.GetValues<FaultKind>().Length];

    /// <summary>Faults of one kind injected so far.</summary>
    public int Count(FaultKind kind) => Volatile.Read(ref _counts[(int)kind]);

    /// <summary>All faults injected so far.</summary>
    public int Total => Enum.GetValues<FaultKind>().Sum(Count);

    /// <summary>A copy of the counts by kind.</summary>
    public IReadOnlyDictionary<FaultKind, int> Snapshot() => Enum.GetValues<FaultKind>().ToDictionary(k => k, Count);

    internal void Record(FaultKind kind) => Interlocked.Increment(ref _counts[(int)kind]);
}
