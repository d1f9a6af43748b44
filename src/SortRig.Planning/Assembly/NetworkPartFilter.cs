using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Network form: can part p be a single at position k in some feasible set? A relaxation that never says no wrongly.
/// <para>
/// Test: every other position l takes a value in a box [lo_l, hi_l] (at first the hull of every value the reel offers
/// there: singles other than p, and for a pair position the pair values); position k is fixed at p's value. Bounds
/// propagation: for each position l without pairs, the smallest and the largest offered single value v in the box are
/// searched such that, with x_l = v and the other positions anywhere in the box, every output error can still lie
/// within its tolerance; the box shrinks to them. No such v, or no box point at all: p is excluded.
/// </para>
/// <para>
/// Proof that it is a relaxation. (1) A set meets an output only if |error(x)| ≤ tolerance, since the real rule adds
/// Σ|∂error/∂R_k| U_k ≥ 0 to |error(x)|; uncertainty can be dropped. (2) With all other resistances fixed, the MNA
/// solution is a rank-one update in one conductance G (Sherman–Morrison), so every node voltage, a ratio of two of
/// them (same denominator cancels) and a position ratio is a linear-fractional function (a + bG) / (c + dG) of G, hence
/// of R = 1/G; without a pole in the interval (the circuit non-singular and the ratio's denominator non-zero for every
/// value in the box, as for the recipes' circuits near their nominal values) it is monotone. (3) A continuous function
/// monotone in each coordinate takes its minimum and maximum over a box at vertices (push each coordinate of an
/// extremum to the endpoint that does not worsen it), and by connectedness every value between. So "some box point
/// meets every output separately" is decided exactly by the vertices, and it is implied by "some box point meets all
/// outputs". (4) Invariant: if p is in a feasible set S, S's member values lie in the box. At the start they do; a
/// member's value x_l passes the test for l (S itself is a box point meeting every output with x_l fixed), so the
/// smallest passing value is ≤ x_l ≤ the largest, and the shrunk box still holds S. Hence p is never excluded.
/// Comparisons are widened by 1e-9 of the tolerance so rounding can only keep a part.
/// </para>
/// Cost: 2^(free positions − 2) network evaluations per test, so the filter is built only for recipes of at most
/// <see cref="MaxPositions"/> positions (not the 16-position R-2R ladder).
/// </summary>
internal sealed class NetworkPartFilter
{
    public const int MaxPositions = 7;
    private const int Rounds = 6;
    private readonly RecipeNetwork _network;

    // Each output's tolerance widened by 1e-9 of itself, so that rounding can only keep parts.
    private readonly double[] _tolerance;
    private readonly (double Value, int Part)[][] _singles;
    private readonly bool[] _pairs;
    private readonly double[] _pairLo;
    private readonly double[] _pairHi;
    private readonly IReadOnlyList<PartCandidate> _usable;
    private readonly int[] _classOf;

    private NetworkPartFilter(
        Recipe recipe,
        NetworkRule rule,
        SweepGeometry geo,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options
    )
    {
        _network = rule.Network;
        var nominal = recipe.Positions.Select(p => p.Nominal).ToArray();
        _tolerance = [.. _network.Evaluate(nominal).Select(o => o.Tolerance * (1 + 1e-9))];
        _usable = usable;
        _classOf = geo.ClassOf;
        var n = recipe.Positions.Count;
        _singles = new (double, int)[n][];
        _pairs = new bool[n];
        _pairLo = Enumerable.Repeat(double.PositiveInfinity, n).ToArray();
        _pairHi = Enumerable.Repeat(double.NegativeInfinity, n).ToArray();
        for (var k = 0; k < n; k++)
        {
            var pos = recipe.Positions[k];
            _singles[k] = usable
                .Select((p, i) => (p.Value.Value, i))
                .Where(t => options.SameNominal(usable[t.i].Nominal, pos.Nominal))
                .Order()
                .ToArray();
            _pairs[k] = pos.Pairs != PairBuilds.None;
            foreach (var build in new[] { PositionBuild.Series, PositionBuild.Parallel })
            {
                if (!pos.Pairs.HasFlag(build == PositionBuild.Series ? PairBuilds.Series : PairBuilds.Parallel))
                {
                    continue;
                }

                var halves = usable
                    .Where(p => options.SameNominal(p.Nominal, PositionSpec.PartNominal(pos.Nominal, build)))
                    .Select(p => p.Value.Value)
                    .ToArray();
                if (halves.Length >= 2)
                {
                    // Series a + b and parallel ab / (a + b) rise with both parts: the hull is at the two extremes.
                    var (min, max) = (halves.Min(), halves.Max());
                    var lo =
                        build == PositionBuild.Series
                            ? SeriesParallel.Series(min, min)
                            : SeriesParallel.Parallel(min, min);
                    var hi =
                        build == PositionBuild.Series
                            ? SeriesParallel.Series(max, max)
                            : SeriesParallel.Parallel(max, max);
                    (_pairLo[k], _pairHi[k]) = (Math.Min(_pairLo[k], lo), Math.Max(_pairHi[k], hi));
                }
            }
        }
    }

    /// <summary>The filter, or null when the recipe is not a network or has too many positions for the vertex
    /// test.</summary>
    public static NetworkPartFilter? TryCreate(
        Recipe recipe,
        ISetRule rule,
        SweepGeometry geo,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options
    ) =>
        rule is NetworkRule network && recipe.Positions.Count <= MaxPositions
            ? new NetworkPartFilter(recipe, network, geo, usable, options)
            : null;

    /// <summary>False only when the part can be a single of class <paramref name="cls"/> in no feasible set.</summary>
    public bool Fits(int cls, int part)
    {
        for (var k = 0; k < _classOf.Length; k++)
        {
            if (_classOf[k] == cls && Possible(k, part))
            {
                return true;
            }
        }

        return false;
    }

    // The part itself fills k, so it is left out of the other positions' single values.
    private bool Possible(int k, int part)
    {
        var value = _usable[part].Value.Value;
        var lo = (double[])_pairLo.Clone();
        var hi = (double[])_pairHi.Clone();
        for (var l = 0; l < lo.Length; l++)
        {
            var others = _singles[l].Where(t => t.Part != part).ToArray();
            if (others.Length > 0)
            {
                (lo[l], hi[l]) = (Math.Min(lo[l], others[0].Value), Math.Max(hi[l], others[^1].Value));
            }
        }

        (lo[k], hi[k]) = (value, value);
        for (var l = 0; l < lo.Length; l++)
        {
            if (!(lo[l] <= hi[l]))
            {
                return false;
            }
        }

        var narrowable = Enumerable.Range(0, lo.Length).Where(l => l != k && !_pairs[l]).ToArray();
        if (narrowable.Length == 0)
        {
            return Meets(lo, hi, -1, 0);
        }

        for (var round = 0; round < Rounds; round++)
        {
            var changed = false;
            foreach (var l in narrowable)
            {
                var values = _singles[l];
                var first = LowerIndex(values, lo[l]);
                var last = UpperIndex(values, hi[l]);
                while (first <= last && (values[first].Part == part || !Meets(lo, hi, l, values[first].Value)))
                {
                    first++;
                }

                while (last > first && (values[last].Part == part || !Meets(lo, hi, l, values[last].Value)))
                {
                    last--;
                }

                if (first > last)
                {
                    return false;
                }

                changed |= values[first].Value > lo[l] || values[last].Value < hi[l];
                (lo[l], hi[l]) = (values[first].Value, values[last].Value);
            }

            if (!changed)
            {
                break;
            }
        }

        return true;
    }

    // Does some point of the box, with position l (if ≥ 0) at v, bring every output's error within its tolerance
    // (each output on its own)? Decided at the vertices (BoxVertices).
    private bool Meets(double[] lo, double[] hi, int l, double v)
    {
        if (l < 0)
        {
            return BoxVertices.CanMeet(_network, lo, hi, _tolerance);
        }

        var fixedLo = (double[])lo.Clone();
        var fixedHi = (double[])hi.Clone();
        fixedLo[l] = v;
        fixedHi[l] = v;
        return BoxVertices.CanMeet(_network, fixedLo, fixedHi, _tolerance);
    }

    private static int LowerIndex((double Value, int Part)[] sorted, double x)
    {
        int lo = 0,
            hi = sorted.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            (lo, hi) = sorted[mid].Value < x ? (mid + 1, hi) : (lo, mid);
        }

        return lo;
    }

    private static int UpperIndex((double Value, int Part)[] sorted, double x)
    {
        int lo = 0,
            hi = sorted.Length;
        while (lo < hi)
        {
            var mid = (lo + hi) / 2;
            (lo, hi) = sorted[mid].Value <= x ? (mid + 1, hi) : (lo, mid);
        }

        return lo - 1;
    }
}
