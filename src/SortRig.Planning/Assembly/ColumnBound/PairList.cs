namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Every pair of an option at one position (X) and an option at another (Y) sharing no part, with the ratio
/// R = value(Y) / value(X), sorted by R (<see cref="RatioPairPricing"/>).
/// </summary>
internal sealed class PairList
{
    private PairList(int[] x, int[] y, double[] r) => (X, Y, R) = (x, y, r);

    /// <summary>Index into the first position's options.</summary>
    public int[] X { get; }

    /// <summary>Index into the second position's options.</summary>
    public int[] Y { get; }

    /// <summary>value(Y) / value(X), ascending.</summary>
    public double[] R { get; }

    public int Count => R.Length;

    /// <summary>Every pair sharing no part whose ratio <paramref name="keep"/> accepts.</summary>
    public static PairList Build(Option[] first, Option[] second, Func<double, bool> keep)
    {
        var x = new List<int>();
        var y = new List<int>();
        var r = new List<double>();
        for (var i = 0; i < first.Length; i++)
        {
            var o = first[i];
            for (var j = 0; j < second.Length; j++)
            {
                var q = second[j];
                if (!o.Uses(q.A) && (q.B < 0 || !o.Uses(q.B)) && keep(q.Value / o.Value))
                {
                    x.Add(i);
                    y.Add(j);
                    r.Add(q.Value / o.Value);
                }
            }
        }

        var ratios = r.ToArray();
        var order = Enumerable.Range(0, ratios.Length).ToArray();
        Array.Sort((double[])ratios.Clone(), order);
        return new PairList(
            [.. order.Select(k => x[k])],
            [.. order.Select(k => y[k])],
            [.. order.Select(k => ratios[k])]
        );
    }

    /// <summary>The entries [lo, hi] (inclusive) as a list of their own.</summary>
    public PairList Slice(int lo, int hi) => new(X[lo..(hi + 1)], Y[lo..(hi + 1)], R[lo..(hi + 1)]);
}
