using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Pricing of the column bound for 4-position networks whose outputs depend only on two position ratios
/// a = R_J / R_I and b = R_L / R_K (<see cref="ScalePairs"/>; the difference amplifiers), at reel scale, exact over
/// the feasible sets (or a proven lower bound on their minimum), like <see cref="NetworkPricing"/> but without
/// enumerating three positions.
/// <para>
/// Family. Every (I, J) option pair with distinct parts is an <i>a-pair</i> with ratio a, every (K, L) pair a
/// <i>b-pair</i> with ratio b, both sorted by ratio. The searched family holds every assignment (an a-pair and a b-pair
/// sharing no part) whose every output error at the measured values is within its tolerance, uncertainty dropped:
/// every feasible set is in it, because the real rule adds Σ_k |∂error/∂R_k| U_k ≥ 0 to |error| (docs/planning.md).
/// Leaves, built once: a-pairs are cut into blocks of consecutive ratios (at most 512, spanning at most 10 ppm); with
/// the outputs linear-fractional, so monotone, in each resistance (the argument of <see cref="NetworkPartFilter"/>),
/// each output is monotone in a on the block and in b, so for a b-pair of ratio b some a of the block meets output o
/// only if the range of its error at the block's two end ratios meets the tolerance, and those b form an interval of
/// the sorted b-pairs (the range's ends are monotone in b), found by bisection. Every a-pair of the block is a leaf
/// with the intersection of those intervals: a superset of its members (widened by the block's span), never smaller.
/// Blocks whose interval is empty hold no member and are dropped.
/// </para>
/// <para>
/// Pricing. Per leaf, the a-pair's cost plus the cheapest b-pair of its interval sharing no part with it (a sparse
/// table for range minima, split around a b-pair that shares a part) is a lower bound on the leaf; leaves in that
/// order, the b-pairs of a leaf in increasing cost (a heap over sub-ranges, the middle first among ties) are judged by
/// the real rule (<see cref="NetworkRule"/>: uncertainty, errors cancelling) until one meets every spec: the leaf's
/// exact minimum over feasible sets, and a column. After <see cref="Tries"/> b-pairs without one, a leaf of at most
/// <see cref="ScanLimit"/> b-pairs is judged in full once (cached); otherwise the cheapest b-pair not judged stands as
/// the leaf's lower bound. So the minimum m is exact or a proven lower bound, and Σ y / m a proven bound (LP duality;
/// Farley 1990, from memory). Comparisons are widened by 1e-8 of the tolerance so rounding can only add members.
/// </para>
/// </summary>
internal sealed partial class RatioPairPricing : IColumnPricing
{
    private const double Slack = 1 + 1e-8;
    private const int Tries = 200;
    private const int ScanLimit = 2_000;
    private const int MaxScans = 40;
    private const int BlockSize = 512;
    private const double BlockSpan = 1e-5;

    /// <summary>Most option pairs per side the pricing builds.</summary>
    public const int MaxPairs = 4_000_000;

    private readonly RecipeNetwork _network;
    private readonly NetworkRule _rule;
    private readonly (int I, int J, int K, int L) _p;
    private readonly Option[][] _options;
    private readonly double[] _nominal;
    private readonly double[] _tolerance;

    // Side a: option indices at I and J with ratio, sorted by ratio; side b the same at K and L (trimmed to the hull
    // of the leaves' intervals after the build).
    private PairList _a;
    private PairList _b;
    private readonly List<(int A, int Lo, int Hi)> _leaves = [];
    private (int Lo, int Hi) _guess;
    private readonly Dictionary<int, int[]> _feasible = [];
    private readonly Dictionary<long, bool> _judged = [];

    private RatioPairPricing(Recipe recipe, CandidatePool pool, NetworkRule rule, (int, int, int, int) pairs)
    {
        _network = rule.Network;
        _rule = rule;
        _p = pairs;
        _nominal = [.. recipe.Positions.Select(p => p.Nominal)];
        _options = [.. pool.Options.Select(o => o.ToArray())];
        _tolerance = [.. _network.Evaluate(_nominal).Select(o => o.Tolerance * Slack)];
        var (aLo, aHi) = Span(_options[_p.I], _options[_p.J]);
        var (bLo, bHi) = Span(_options[_p.K], _options[_p.L]);
        _a = PairList.Build(_options[_p.I], _options[_p.J], Admissible(aLo, aHi, bLo, bHi, sideA: true));
        _b = PairList.Build(_options[_p.K], _options[_p.L], Admissible(bLo, bHi, aLo, aHi, sideA: false));
    }

    public string Family =>
        "every feasible set (the real rule), searched by ratio interval within the assignments meeting every output "
        + "at the measured values (outputs depend on two position ratios)";

    /// <summary>Leaves (a-pairs with a non-empty interval of b-pairs).</summary>
    public int Leaves => _leaves.Count;

    /// <summary>
    /// The pricing, or null when the recipe is not a 4-position network with two scale-invariant position pairs, a
    /// side has more than <see cref="MaxPairs"/> option pairs, or <paramref name="stop"/> cut the build short.
    /// </summary>
    public static RatioPairPricing? TryCreate(
        Recipe recipe,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options,
        Func<bool> stop
    )
    {
        if (recipe.Form != RecipeForm.Network || recipe.Positions.Count != 4)
        {
            return null;
        }

        var rule = new NetworkRule(recipe);
        var pairs = ScalePairs.Find(rule.Network, [.. recipe.Positions.Select(p => p.Nominal)]);
        if (pairs is not { } p)
        {
            return null;
        }

        var pool = new CandidatePool(recipe, usable, options, withPairs: true);
        if (
            pool.Usable.Count != usable.Count
            || pool.Options.Any(o => o.Count == 0)
            || (long)pool.Options[p.I].Count * pool.Options[p.J].Count > MaxPairs
            || (long)pool.Options[p.K].Count * pool.Options[p.L].Count > MaxPairs
        )
        {
            return null;
        }

        var pricing = new RatioPairPricing(recipe, pool, rule, p);
        return pricing.Build(stop) ? pricing : null;
    }

    /// <summary>Whether <paramref name="recipe"/> is priced this way (4 positions, two scale-invariant
    /// pairs).</summary>
    public static bool Applies(Recipe recipe) =>
        recipe.Form == RecipeForm.Network
        && recipe.Positions.Count == 4
        && ScalePairs.Find(new RecipeNetwork(recipe), [.. recipe.Positions.Select(p => p.Nominal)]) is not null;

    /// <summary>
    /// True when some member of the searched family (a leaf's a-pair with a b-pair of its interval) uses exactly these
    /// parts (indices into the usable parts): the family must hold every feasible set. For tests.
    /// </summary>
    public bool Covers(IReadOnlyCollection<int> parts)
    {
        var set = parts.ToHashSet();
        foreach (var (a, lo, hi) in _leaves)
        {
            var used = APartsOf(a);
            if (!used.All(set.Contains))
            {
                continue;
            }

            for (var m = lo; m <= hi; m++)
            {
                var all = used.Concat(BPartsOf(m)).ToArray();
                if (all.Length == set.Count && all.Distinct().Count() == all.Length && all.All(set.Contains))
                {
                    return true;
                }
            }
        }

        return false;
    }

    private int[] APartsOf(int a) => Parts(_options[_p.I][_a.X[a]], _options[_p.J][_a.Y[a]]);

    private int[] BPartsOf(int m) => Parts(_options[_p.K][_b.X[m]], _options[_p.L][_b.Y[m]]);

    private static int[] Parts(Option x, Option y) =>
        [x.A, .. x.B >= 0 ? new[] { x.B } : [], y.A, .. y.B >= 0 ? new[] { y.B } : []];
}
