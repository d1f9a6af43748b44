namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Rows of an aggregated set-packing master: the K scarcest parts keep a row each (capacity 1), the other parts of
/// one nominal share a row whose capacity is their count (entries divided by it, so every right-hand side is 1).
/// Summing rows of a packing programme relaxes it, so the aggregated LP is at least the LP over the parts; its duals,
/// spread over the pooled parts (each gets the pool's dual over its count), are a dual vector of the part LP, and
/// once exact pricing finds no set below 1 at those duals they are feasible there too (LP duality, textbook). Where the
/// part LP's optimal duals are equal within each pool, the two LPs are equal.
/// </summary>
internal sealed class PartAggregation
{
    private readonly int[] _rowOf;
    private readonly double[] _entry;

    /// <summary>Aggregation with the first <paramref name="own"/> parts of <paramref name="order"/> on their own
    /// rows.</summary>
    public PartAggregation(IReadOnlyList<int> order, int own, int[] classOf)
    {
        var n = classOf.Length;
        own = Math.Clamp(own, 0, n);
        _rowOf = new int[n];
        _entry = new double[n];
        Own = own;
        var classes = n == 0 ? 0 : classOf.Max() + 1;
        var pooled = new int[classes];
        var isOwn = new bool[n];
        for (var r = 0; r < own; r++)
        {
            isOwn[order[r]] = true;
            _rowOf[order[r]] = r;
            _entry[order[r]] = 1;
        }

        for (var i = 0; i < n; i++)
        {
            pooled[classOf[i]] += isOwn[i] ? 0 : 1;
        }

        // Pool rows only for classes with parts left in the pool, numbered after the own rows.
        var poolRow = new int[classes];
        var rows = own;
        for (var c = 0; c < classes; c++)
        {
            poolRow[c] = pooled[c] > 0 ? rows++ : -1;
        }

        for (var i = 0; i < n; i++)
        {
            if (!isOwn[i])
            {
                _rowOf[i] = poolRow[classOf[i]];
                _entry[i] = 1.0 / pooled[classOf[i]];
            }
        }

        Rows = rows;
    }

    /// <summary>Parts on their own rows.</summary>
    public int Own { get; }

    /// <summary>Rows of the master.</summary>
    public int Rows { get; }

    /// <summary>The master column of a set of distinct parts.</summary>
    public List<(int Row, double Value)> Column(int[] parts)
    {
        var byRow = new Dictionary<int, double>();
        foreach (var i in parts)
        {
            byRow[_rowOf[i]] = byRow.GetValueOrDefault(_rowOf[i]) + _entry[i];
        }

        return [.. byRow.Select(e => (e.Key, e.Value))];
    }

    /// <summary>Part duals from the master's row duals (clipped at 0): a pooled part gets its row's dual times its
    /// entry.</summary>
    public double[] PartDuals(ReadOnlySpan<double> rowDuals)
    {
        var y = new double[_rowOf.Length];
        for (var i = 0; i < y.Length; i++)
        {
            y[i] = Math.Max(0, rowDuals[_rowOf[i]]) * _entry[i];
        }

        return y;
    }

    /// <summary>
    /// Parts from scarcest to most common: a part's score is, over every nominal on hand, the share of that nominal's
    /// parts within one match window of it on z = ln(value / nominal), and the smallest share counts (a part with few
    /// partners of some nominal nearby is where the part LP's duals depart from a price per nominal); ties by distance
    /// from the median z, farthest first.
    /// </summary>
    public static int[] ScarcityOrder(double[] z, int[] classOf, double window)
    {
        var n = z.Length;
        if (n == 0)
        {
            return [];
        }

        var classes = classOf.Max() + 1;
        var sorted = Enumerable
            .Range(0, classes)
            .Select(c => Enumerable.Range(0, n).Where(i => classOf[i] == c).Select(i => z[i]).Order().ToArray())
            .ToArray();
        var median = z.Order().ElementAt(n / 2);
        var score = new double[n];
        for (var i = 0; i < n; i++)
        {
            var s = double.PositiveInfinity;
            foreach (var zs in sorted)
            {
                var near = LowerBound(zs, z[i] + window, upper: true) - LowerBound(zs, z[i] - window, upper: false);
                s = Math.Min(s, (double)near / zs.Length);
            }

            score[i] = s;
        }

        return
        [
            .. Enumerable
                .Range(0, n)
                .OrderBy(i => score[i])
                .ThenByDescending(i => Math.Abs(z[i] - median))
                .ThenBy(i => i),
        ];
    }

    // First index with zs[index] > x (upper) or ≥ x (lower).
    private static int LowerBound(double[] zs, double x, bool upper)
    {
        var (lo, hi) = (0, zs.Length);
        while (lo < hi)
        {
            var mid = (lo + hi) >> 1;
            if (upper ? zs[mid] <= x : zs[mid] < x)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }
}
