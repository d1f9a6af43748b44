namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// The restricted master of the set-packing LP: max Σ_j x_j subject to Σ_{j ∋ i} x_j ≤ 1 for every part i, x ≥ 0,
/// over the columns (sets of parts) added so far: the 0/1 case of <see cref="PackingMaster"/> (one row per part),
/// which keeps the columns as sets of parts for the callers that pack them.
/// </summary>
internal sealed class ColumnMaster(int rows, int seed = 1)
{
    private readonly PackingMaster _master = new(rows, seed);
    private readonly List<int[]> _columns = [];

    public int ColumnCount => _columns.Count;

    /// <summary>Every column added so far (sorted part indices).</summary>
    public IReadOnlyList<int[]> AllColumns => _columns;

    /// <summary>Master objective Σ x over the basic columns.</summary>
    public double Value => _master.Value;

    /// <summary>Current duals, one per part (may be slightly negative through rounding; the caller clips).</summary>
    public ReadOnlySpan<double> Duals => _master.Duals;

    /// <summary>The current primal solution, one value per column of <see cref="AllColumns"/> (0 for a nonbasic
    /// column).</summary>
    public double[] Primal() => _master.Primal();

    /// <summary>Adds a column (distinct part indices); false when it is already there.</summary>
    public bool Add(int[] parts)
    {
        var sorted = parts.Order().ToArray();
        if (!_master.Add(sorted.Select(i => (i, 1.0)).ToArray()))
        {
            return false;
        }

        _columns.Add(sorted);
        return true;
    }

    /// <summary>Pivots until no column prices out or the cap or the stop hits; true when optimal.</summary>
    public bool Solve(int maxPivots, Func<bool> stop) => _master.Solve(maxPivots, stop);
}
