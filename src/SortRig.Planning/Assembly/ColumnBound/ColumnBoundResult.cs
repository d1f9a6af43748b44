namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// A proven bound from the set-packing LP with its certificate: duals y ≥ 0 and m, a proven lower bound on
/// min Σ_{i∈S} y_i over a family holding every feasible set. Then y / m is dual feasible, so LP ≤ Σ y / m and the
/// number of disjoint feasible sets is at most ⌊Σ y / m⌋.
/// </summary>
/// <param name="Bound">⌊Value⌋ (with a 1e-6 allowance for rounding).</param>
/// <param name="Value">Σ y / m.</param>
/// <param name="Duals">y, one per usable part.</param>
/// <param name="MinSetCost">m.</param>
/// <param name="Columns">Columns in the restricted master at the end.</param>
/// <param name="Rounds">Pricing rounds.</param>
/// <param name="Converged">True when pricing found no set below 1 (the LP optimum over the family was reached).</param>
/// <param name="Family">The priced family, in words.</param>
internal sealed record ColumnBoundResult(
    int Bound,
    double Value,
    double[] Duals,
    double MinSetCost,
    int Columns,
    int Rounds,
    bool Converged,
    string Family
)
{
    /// <summary>Every column of the restricted master at the end: the starting sets and the feasible sets pricing
    /// found (each judged by the set rule), as part indices; a pool for packing, not part of the proof.</summary>
    public IReadOnlyList<int[]> Pool { get; init; } = [];

    /// <summary>
    /// The bound one pricing round proves, Σ y / m (LP duality; 0 when no feasible set exists, none while m = 0), as a
    /// result when it beats <paramref name="best"/>; else <paramref name="best"/>.
    /// </summary>
    public static ColumnBoundResult? Better(
        ColumnBoundResult? best,
        double[] y,
        PricingResult priced,
        int columns,
        int round,
        Func<string> family
    )
    {
        var value =
            double.IsPositiveInfinity(priced.Min) ? 0
            : priced.Min > 0 ? y.Sum() / priced.Min
            : double.PositiveInfinity;
        return double.IsFinite(value) && (best is null || value < best.Value)
            ? new(
                (int)Math.Floor(value + 1e-6),
                value,
                y,
                priced.Min,
                columns,
                round,
                priced.Columns.Count == 0,
                family()
            )
            : best;
    }

    /// <summary>The restricted master's last primal solution, one value per column of <see cref="Pool"/>.</summary>
    public double[] PoolValues { get; init; } = [];
}
