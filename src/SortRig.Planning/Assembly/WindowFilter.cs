namespace SortRig.Planning.Assembly;

/// <summary>
/// Matched form: can a part be a single of class j in some feasible set? A set is feasible iff its members' intervals
/// of admissible common points share a point c; so the part's interval must contain a point where every class without
/// pairs has at least Demand intervals (pair classes are not counted, which only keeps more parts). Coverage only
/// rises at left ends, so it is enough to test the part's own left end and every left end inside its interval.
/// Intervals are widened by 1e-9 so rounding can only keep a part, never drop one.
/// </summary>
internal sealed class WindowFilter
{
    private const double Slack = 1e-9;
    private readonly SweepGeometry _geo;
    private readonly double[][] _lefts;
    private readonly double[][] _rights;
    private readonly double[] _good;
    private readonly bool[] _pairClass;
    private readonly Dictionary<(int Class, int Part), (double Left, double Right)> _own = [];

    public WindowFilter(
        SweepGeometry geo,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options,
        bool[] pairClass
    )
    {
        _geo = geo;
        _pairClass = pairClass;
        var lefts = Enumerable.Range(0, geo.Nominals.Length).Select(_ => new List<double>()).ToArray();
        var rights = Enumerable.Range(0, geo.Nominals.Length).Select(_ => new List<double>()).ToArray();
        for (var i = 0; i < usable.Count; i++)
        {
            for (var j = 0; j < geo.Nominals.Length; j++)
            {
                if (
                    options.SameNominal(usable[i].Nominal, geo.Nominals[j])
                    && geo.Item(j, Option.Single(i, usable[i]), 0) is { } it
                )
                {
                    _own[(j, i)] = (it.Left - Slack, it.Right + Slack);
                    lefts[j].Add(it.Left - Slack);
                    rights[j].Add(it.Right + Slack);
                }
            }
        }

        _lefts = lefts.Select(l => l.Order().ToArray()).ToArray();
        _rights = rights.Select(r => r.Order().ToArray()).ToArray();
        _good = Enumerable
            .Range(0, _lefts.Length)
            .Where(j => !pairClass[j])
            .SelectMany(j => _lefts[j])
            .Where(Covered)
            .Order()
            .ToArray();
    }

    public bool Fits(int cls, int part)
    {
        if (!_own.TryGetValue((cls, part), out var iv))
        {
            return false;
        }

        if (Covered(iv.Left))
        {
            return true;
        }

        var at = Array.BinarySearch(_good, iv.Left);
        at = at < 0 ? ~at : at;
        return at < _good.Length && _good[at] <= iv.Right;
    }

    private bool Covered(double c)
    {
        for (var j = 0; j < _lefts.Length; j++)
        {
            if (!_pairClass[j] && CountAtMost(_lefts[j], c) - CountBelow(_rights[j], c) < _geo.Demand[j])
            {
                return false;
            }
        }

        return true;
    }

    private static int CountAtMost(double[] sorted, double x)
    {
        int lo = 0,
            hi = sorted.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            (lo, hi) = sorted[mid] <= x ? (mid + 1, hi) : (lo, mid);
        }

        return lo;
    }

    private static int CountBelow(double[] sorted, double x)
    {
        int lo = 0,
            hi = sorted.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            (lo, hi) = sorted[mid] < x ? (mid + 1, hi) : (lo, mid);
        }

        return lo;
    }
}
