using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// The fast path. Pass 1: singles only, by the interval sweep. Pass 2 (recipes allowing pairs): leftover parts of
/// each pair nominal are paired lowest-with-highest (a high part and a low one make a centred pair) or with their
/// neighbour in value (a pair where its parts lie: a reel with no parts near nominal) and swept with the leftover
/// singles; the share of each pool paired (from the extremes inwards) is tried in 32nds, both ways, and the best
/// kept. Pass 3: singles again with the parts of unused pairs. Every set is then arranged onto
/// positions (network form: parts nearest the common point go to the most sensitive positions) and verified.
/// </summary>
internal sealed class SweepPlanner(Recipe recipe, CandidatePool pool, ISetRule rule, AssemblyOptions options)
{
    // Shares of each pair pool tried (from the extremes inwards): 1/32, 2/32, ... 32/32, each way.
    private const int PairingSteps = 32;
    private readonly SweepGeometry _geo = new(recipe, rule);
    private readonly bool[] _used = new bool[pool.Usable.Count];

    public bool ProvenOptimal { get; private set; }

    public int Dropped { get; private set; }

    public List<(Option[] Fills, SetVerdict Verdict)> Run()
    {
        var result = new List<(Option[], SetVerdict)>();
        var singles = Singles(exclude: null);
        var anyPairs = recipe.Positions.Any(p => p.Pairs != PairBuilds.None);
        ProvenOptimal =
            recipe.Form == RecipeForm.Matched && !anyPairs && IntervalSweep.AllProper(singles, _geo.Demand.Length);
        Take(IntervalSweep.Run(singles, _geo.Demand, _geo.PairCaps), result);
        if (anyPairs)
        {
            // Try pairing the most extreme leftovers in steps of 1/8 of each pool; keep the step with most sets.
            // Two ways to pair: lowest with highest (centred pairs, for a reel dense in the middle) and neighbours in
            // value (pairs where their parts lie, for a reel with a gap in the middle or sets far from nominal).
            List<List<SweepItem>> best = [];
            foreach (var neighbours in new[] { false, true })
            {
                for (var step = 1; step <= PairingSteps; step++)
                {
                    var paired = new bool[_used.Length];
                    var pairs = Pairs(paired, step / (double)PairingSteps, neighbours);
                    var sets = IntervalSweep.Run(Singles(paired).Concat(pairs).ToList(), _geo.Demand, _geo.PairCaps);
                    // Ties go to the later try (more pairs, neighbours): measured one more set after repair on the
                    // bimodal R-2R reel (51 vs 50), none lost elsewhere.
                    best = sets.Count >= best.Count ? sets : best;
                }
            }

            Take(best, result);
            Take(IntervalSweep.Run(Singles(exclude: null), _geo.Demand, _geo.PairCaps), result);
        }

        return result;
    }

    private List<SweepItem> Singles(bool[]? exclude)
    {
        var items = new List<SweepItem>();
        for (var i = 0; i < _used.Length; i++)
        {
            var cls = Array.FindIndex(_geo.Nominals, n => options.SameNominal(pool.Usable[i].Nominal, n));
            if (
                !_used[i]
                && exclude?[i] != true
                && cls >= 0
                && _geo.Item(cls, Option.Single(i, pool.Usable[i]), 0) is { } item
            )
            {
                items.Add(item);
            }
        }

        return items;
    }

    private List<SweepItem> Pairs(bool[] paired, double fraction, bool neighbours)
    {
        var items = new List<SweepItem>();
        for (var j = 0; j < _geo.Nominals.Length; j++)
        {
            foreach (var (build, kind) in new[] { (PositionBuild.Series, 1), (PositionBuild.Parallel, 2) })
            {
                if (_geo.PairCaps[j, kind - 1] + _geo.PairCaps[j, 2] == 0)
                {
                    continue;
                }

                var source = PositionSpec.PartNominal(_geo.Nominals[j], build);
                var free = Enumerable
                    .Range(0, _used.Length)
                    .Where(i => !_used[i] && !paired[i] && options.SameNominal(pool.Usable[i].Nominal, source))
                    .OrderBy(i => pool.Usable[i].Value.Value)
                    .ToArray();
                var count = (int)Math.Round(free.Length * fraction / 2);
                var chosen = neighbours ? NeighbourPairs(free.Length, count) : ExtremePairs(free.Length, count);
                foreach (var (a, b) in chosen)
                {
                    var o = Option.Pair(build, free[a], pool.Usable[free[a]], free[b], pool.Usable[free[b]]);
                    if (_geo.Item(j, o, kind) is { } item)
                    {
                        items.Add(item);
                        paired[free[a]] = paired[free[b]] = true;
                    }
                }
            }
        }

        return items;
    }

    // Lowest with highest, from the extremes inwards.
    private static IEnumerable<(int, int)> ExtremePairs(int n, int count)
    {
        for (int lo = 0, hi = n - 1; lo < hi && lo < count; lo++, hi--)
        {
            yield return (lo, hi);
        }
    }

    // Neighbours in sorted order, taken from both tails inwards alternately.
    private static IEnumerable<(int, int)> NeighbourPairs(int n, int count)
    {
        for (int lo = 0, hi = n - 1, made = 0; hi - lo >= 1 && made < count; made++)
        {
            if (made % 2 == 0)
            {
                yield return (lo, lo + 1);
                lo += 2;
            }
            else
            {
                yield return (hi - 1, hi);
                hi -= 2;
            }
        }
    }

    private void Take(List<List<SweepItem>> sets, List<(Option[], SetVerdict)> result)
    {
        foreach (var set in sets)
        {
            var fills = SweepArrangement.Arrange(recipe, _geo, set);
            var verdict = rule.Judge(fills);
            if (!verdict.Meets)
            {
                Dropped++;
                continue;
            }

            foreach (var f in fills)
            {
                _used[f.A] = true;
                if (f.B >= 0)
                {
                    _used[f.B] = true;
                }
            }

            result.Add((fills, verdict));
        }
    }
}
