using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// A start for networks whose outputs depend only on two ratios a = R_J / R_I and b = R_L / R_K (the difference
/// amplifiers; <see cref="ScalePairs"/>), when both sides take the same two distinct nominals. Sets are then two
/// ratio pairs whose ratios the specs allow together, so: (1) pair parts of the two nominals into ratio pairs with
/// ln(R_J / R_I) within ±w of the centre, as many as possible (points in intervals of equal width, sorted: taking the
/// lowest free point of each interval in order is a maximum matching, a textbook greedy); (2) judge every two pairs
/// close enough in ratio by the real rule (uncertainty and error cancellation) and join them by a greedy matching
/// (fewest partners first). Several w are tried, the most sets kept. It sees the whole reel at once, where the sweep's
/// common window and the neighbourhood search's 20-part windows cannot move a pairing from one end of a mode to the
/// other. Pure.
/// </summary>
internal static class RatioPairStart
{
    // Pair windows as shares of the joint shift of a = b, in the order tried: above 1 the pairs lean on partners that
    // compensate. On the 1 000-part g10 reels (share: sets, normal / bimodal) 0.45: 232 / 235, 0.9: 245 / 239,
    // 1.5: 248 / 244, 2: 249 / 249 (the part count); about 1.5-2 s each at load 2-3.
    private static readonly double[] s_widths = [2, 3, 1.5, 1];

    /// <summary>The sets, or an empty list when the recipe does not have this structure; and a proven upper bound on
    /// the number of sets (null then): every set holds a ratio pair a within the range some partner b allows, a pair
    /// b within the range some a allows (<see cref="Reach"/>, zero uncertainty: supersets), and so two disjoint pairs
    /// within their union; the sets are at most the most disjoint pairs in a's range, in b's, and half those in the
    /// union, each found exactly by the same greedy (Glover 1967, from memory: intervals of equal width in order, each
    /// taking the lowest free point).</summary>
    public static (List<(Option[] Fills, SetVerdict Verdict)> Sets, int? Bound) Run(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        ISetRule rule,
        AssemblyOptions options,
        int target = int.MaxValue,
        Func<bool>? stop = null
    )
    {
        if (rule is not NetworkRule network || recipe.Positions.Count != 4)
        {
            return ([], null);
        }

        var nominal = recipe.Positions.Select(p => p.Nominal).ToArray();
        if (ScalePairs.Find(network.Network, nominal) is not var (i, j, k, l))
        {
            return ([], null);
        }

        if (
            !options.SameNominal(nominal[i], nominal[k])
            || !options.SameNominal(nominal[j], nominal[l])
            || options.SameNominal(nominal[i], nominal[j])
            || recipe.Positions.Any(pos => pos.Pairs != PairBuilds.None)
        )
        {
            return ([], null);
        }

        if (Ranges(rule, nominal, (i, j, k, l)) is not var (centre, shift, a, b))
        {
            return ([], null);
        }

        // Each set holds one pair within a's range, one within b's, and two within their union, all disjoint.
        var xs = Pool(usable, nominal[i], options);
        var ys = Pool(usable, nominal[j], options);
        var inA = Pairs(xs, ys, centre - a.Down, centre + a.Up).Count;
        var inB = Pairs(xs, ys, centre - b.Down, centre + b.Up).Count;
        var inEither = Pairs(xs, ys, centre - Math.Max(a.Down, b.Down), centre + Math.Max(a.Up, b.Up)).Count;
        var bound = Math.Min(Math.Min(inA, inB), inEither / 2);
        // Two pairs of one set differ in ratio by at most the larger reach on each side.
        var reach = Math.Max(a.Down, b.Down) + Math.Max(a.Up, b.Up);
        List<(Option[] Fills, SetVerdict Verdict)> best = [];
        foreach (var share in s_widths)
        {
            if (best.Count >= target || (best.Count > 0 && stop?.Invoke() == true))
            {
                break;
            }

            var sets = Assemble(rule, (i, j, k, l), xs, ys, centre, share * shift, reach);
            if (sets.Count > best.Count)
            {
                best = sets;
            }
        }

        return (best, bound);
    }

    /// <summary>In ln(ratio / nominal ratio), zero uncertainty, every other part at nominal: the centre (a = b there
    /// meets the specs best), the largest shift of a = b together from it, how far a may lie below and above it with
    /// the best partner b, and the same for b (a difference amplifier's gain rests mostly on a, so b reaches
    /// further); null when even the centre fails.</summary>
    internal static (double Centre, double Shift, (double Down, double Up) A, (double Down, double Up) B)? Ranges(
        ISetRule rule,
        double[] nominal,
        (int I, int J, int K, int L) p
    )
    {
        var score = (double t) => Score(rule, nominal, p, t, t);
        var score2 = (double ta, double tb) => Score(rule, nominal, p, ta, tb);
        var centre = Minimise(score, -0.02, 0.02);
        if (!(score(centre) <= 1))
        {
            return null;
        }

        double lo = 0,
            hi = 0.05;
        for (var it = 0; it < 60; it++)
        {
            var mid = (lo + hi) / 2;
            (lo, hi) = score(centre + mid) <= 1 && score(centre - mid) <= 1 ? (mid, hi) : (lo, mid);
        }

        var swapped = (double tb, double ta) => score2(ta, tb);
        return (
            centre,
            lo,
            (Reach(score2, centre, -1), Reach(score2, centre, +1)),
            (Reach(swapped, centre, -1), Reach(swapped, centre, +1))
        );
    }

    /// <summary>How far ln a may lie from the centre in one direction when b may be anything (zero uncertainty):
    /// bisection on the distance, the best partner b by golden section over the centre ± 5 % (the score, a largest
    /// error over the outputs, is unimodal in b for these networks; checked against a grid in the tests).</summary>
    internal static double Reach(Func<double, double, double> score, double centre, int sign)
    {
        double lo = 0,
            hi = 0.05;
        for (var it = 0; it < 50; it++)
        {
            var mid = (lo + hi) / 2;
            var ta = centre + (sign * mid);
            var tb = Minimise(t => score(ta, t), centre - 0.05, centre + 0.05);
            (lo, hi) = score(ta, tb) <= 1 ? (mid, hi) : (lo, mid);
        }

        // Widened by 1 % and 1 ppm against the searches' tolerances: a wider range only loosens the bound.
        return (hi * 1.01) + 1e-6;
    }

    // Ratio pairs: x's admissible y deviations are [zx + from, zx + to]; equal widths, so in order of zx the lowest
    // free y at or above the left end is taken (a maximum matching).
    private static List<(double T, Option X, Option Y)> Pairs(
        List<(int Index, double Z, Option Fill)> xs,
        List<(int Index, double Z, Option Fill)> ys,
        double from,
        double to
    )
    {
        var pairs = new List<(double T, Option X, Option Y)>();
        var next = 0;
        foreach (var x in xs)
        {
            while (next < ys.Count && ys[next].Z < x.Z + from)
            {
                next++;
            }

            if (next < ys.Count && ys[next].Z <= x.Z + to)
            {
                pairs.Add((ys[next].Z - x.Z, x.Fill, ys[next].Fill));
                next++;
            }
        }

        return pairs;
    }

    private static List<(Option[] Fills, SetVerdict Verdict)> Assemble(
        ISetRule rule,
        (int I, int J, int K, int L) p,
        List<(int Index, double Z, Option Fill)> xs,
        List<(int Index, double Z, Option Fill)> ys,
        double centre,
        double w,
        double reach
    )
    {
        var pairs = Pairs(xs, ys, centre - w, centre + w);

        // (2) pairs joined into sets: every two pairs within `reach` of each other in ratio judged by the real rule
        // (either pair on either side), then a greedy matching that takes the pair with the fewest partners left and
        // joins it to its partner with the fewest (a common heuristic for maximum matching, no source).
        pairs.Sort((a, b) => a.T.CompareTo(b.T));
        var edges = new List<(int Other, Option[] Fills, SetVerdict Verdict)>[pairs.Count];
        var fills = new Option[4];
        for (var n = 0; n < pairs.Count; n++)
        {
            edges[n] ??= [];
            for (var m = n + 1; m < pairs.Count && pairs[m].T - pairs[n].T <= reach; m++)
            {
                (Option[] Fills, SetVerdict Verdict)? made = null;
                foreach (var (a, b) in new[] { (pairs[n], pairs[m]), (pairs[m], pairs[n]) })
                {
                    (fills[p.I], fills[p.J], fills[p.K], fills[p.L]) = (a.X, a.Y, b.X, b.Y);
                    var verdict = rule.Judge(fills);
                    if (verdict.Meets && (made is null || verdict.Score < made.Value.Verdict.Score))
                    {
                        made = ((Option[])fills.Clone(), verdict);
                    }
                }

                if (made is { } set)
                {
                    edges[n].Add((m, set.Fills, set.Verdict));
                    (edges[m] ??= []).Add((n, set.Fills, set.Verdict));
                }
            }
        }

        var sets = new List<(Option[] Fills, SetVerdict Verdict)>();
        var taken = new bool[pairs.Count];
        var degree = edges.Select(e => e.Count).ToArray();
        while (true)
        {
            var v = -1;
            for (var n = 0; n < pairs.Count; n++)
            {
                if (!taken[n] && degree[n] > 0 && (v < 0 || degree[n] < degree[v]))
                {
                    v = n;
                }
            }

            if (v < 0)
            {
                break;
            }

            var best = edges[v].Where(e => !taken[e.Other]).MinBy(e => degree[e.Other]);
            sets.Add((best.Fills, best.Verdict));
            foreach (var end in new[] { v, best.Other })
            {
                taken[end] = true;
                foreach (var e in edges[end])
                {
                    degree[e.Other]--;
                }
            }
        }

        return sets;
    }

    private static List<(int Index, double Z, Option Fill)> Pool(
        IReadOnlyList<PartCandidate> usable,
        double nominal,
        AssemblyOptions options
    ) =>
        [
            .. Enumerable
                .Range(0, usable.Count)
                .Where(n => options.SameNominal(usable[n].Nominal, nominal))
                .Select(n => (n, Math.Log(usable[n].Value.Value / nominal), Option.Single(n, usable[n])))
                .OrderBy(e => e.Item2),
        ];

    // Worst score of the set with every part at nominal except a = centre·e^ta and b = centre·e^tb, no uncertainty.
    private static double Score(ISetRule rule, double[] nominal, (int I, int J, int K, int L) p, double ta, double tb)
    {
        var fills = nominal.Select((v, n) => new Option(PositionBuild.Single, n, -1, v, 0)).ToArray();
        fills[p.J] = fills[p.J] with { Value = nominal[p.J] * Math.Exp(ta) };
        fills[p.L] = fills[p.L] with { Value = nominal[p.L] * Math.Exp(tb) };
        return rule.Judge(fills).Score;
    }

    // Golden-section search for the minimum of a unimodal function on [a, b] (textbook).
    private static double Minimise(Func<double, double> f, double a, double b)
    {
        var g = (Math.Sqrt(5) - 1) / 2;
        double c = b - (g * (b - a)),
            d = a + (g * (b - a));
        for (var it = 0; it < 80; it++)
        {
            if (f(c) < f(d))
            {
                b = d;
            }
            else
            {
                a = c;
            }

            c = b - (g * (b - a));
            d = a + (g * (b - a));
        }

        return (a + b) / 2;
    }
}
