namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Index of the smallest value in any range of a fixed array in O(1) after O(n log n) preparation: a sparse table of
/// the minima of every range of length 2^j (textbook: range-minimum queries by overlapping powers of two).
/// </summary>
internal sealed class RangeMin
{
    private readonly int[][] _table;

    public RangeMin(double[] values)
    {
        Values = values;
        var levels = 1;
        while (1 << levels <= values.Length)
        {
            levels++;
        }

        _table = new int[levels][];
        _table[0] = [.. Enumerable.Range(0, values.Length)];
        for (var j = 1; j < levels; j++)
        {
            var span = 1 << j;
            var prev = _table[j - 1];
            var row = new int[Math.Max(0, values.Length - span + 1)];
            for (var i = 0; i < row.Length; i++)
            {
                var (p, q) = (prev[i], prev[i + (span >> 1)]);
                row[i] = values[q] < values[p] ? q : p;
            }

            _table[j] = row;
        }
    }

    public double[] Values { get; }

    /// <summary>Index of the smallest value in [a, b] (inclusive, a ≤ b); the lowest such index on ties is not
    /// promised.</summary>
    public int ArgMin(int a, int b)
    {
        var j = System.Numerics.BitOperations.Log2((uint)(b - a + 1));
        var (p, q) = (_table[j][a], _table[j][b - (1 << j) + 1]);
        return Values[q] < Values[p] ? q : p;
    }
}
