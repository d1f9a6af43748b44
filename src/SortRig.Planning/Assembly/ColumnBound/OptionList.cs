using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly.ColumnBound;

/// <summary>
/// Every way to fill one matched-form position (singles of its nominal, and every pair of the pair nominal it allows),
/// as intervals [Lo, Hi] on z = ln(value / nominal) with the worst-case uncertainty, sorted by Hi.
/// </summary>
internal sealed class OptionList
{
    private OptionList(List<(double Lo, double Hi, int A, int B)> options)
    {
        options.Sort((p, q) => p.Hi.CompareTo(q.Hi));
        Lo = options.Select(o => o.Lo).ToArray();
        Hi = options.Select(o => o.Hi).ToArray();
        A = options.Select(o => o.A).ToArray();
        B = options.Select(o => o.B).ToArray();
    }

    public double[] Lo { get; }

    public double[] Hi { get; }

    /// <summary>First part (index into the usable parts).</summary>
    public int[] A { get; }

    /// <summary>Second part of a pair, or -1.</summary>
    public int[] B { get; }

    public int Count => Lo.Length;

    public double MinLo => Lo.Min();

    public double MaxHi => Hi[^1];

    public static OptionList Build(
        PositionSpec position,
        int k,
        MatchedRule rule,
        IReadOnlyList<PartCandidate> usable,
        AssemblyOptions options
    )
    {
        var list = new List<(double, double, int, int)>();
        for (var i = 0; i < usable.Count; i++)
        {
            if (options.SameNominal(usable[i].Nominal, position.Nominal))
            {
                var o = Option.Single(i, usable[i]);
                list.Add((rule.Lo(k, o), rule.Hi(k, o), i, -1));
            }
        }

        foreach (var build in new[] { PositionBuild.Series, PositionBuild.Parallel })
        {
            if (!position.Pairs.HasFlag(build == PositionBuild.Series ? PairBuilds.Series : PairBuilds.Parallel))
            {
                continue;
            }

            var nominal = PositionSpec.PartNominal(position.Nominal, build);
            var idx = Enumerable
                .Range(0, usable.Count)
                .Where(i => options.SameNominal(usable[i].Nominal, nominal))
                .ToArray();
            for (var x = 0; x < idx.Length; x++)
            {
                for (var y = x + 1; y < idx.Length; y++)
                {
                    var o = Option.Pair(build, idx[x], usable[idx[x]], idx[y], usable[idx[y]]);
                    var (lo, hi) = (rule.Lo(k, o), rule.Hi(k, o));
                    // A pair wider than the window fits no set.
                    if (hi - lo <= rule.Window * (1 + 1e-9))
                    {
                        list.Add((lo, hi, idx[x], idx[y]));
                    }
                }
            }
        }

        return new OptionList(list);
    }
}
