using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>One way to fill one position: a single part (B = -1) or a pair, by index into the part list.</summary>
internal readonly record struct Option(PositionBuild Build, int A, int B, double Value, double Uncertainty)
{
    public ulong Mask => (1UL << A) | (B >= 0 ? 1UL << B : 0UL);

    public bool Uses(int part) => A == part || B == part;

    public static Option Single(int index, PartCandidate p) =>
        new(PositionBuild.Single, index, -1, p.Value.Value, p.Value.ExpandedTransfer);

    public static Option Pair(PositionBuild build, int i, PartCandidate a, int j, PartCandidate b)
    {
        var parallel = build == PositionBuild.Parallel;
        var (r1, r2) = (a.Value.Value, b.Value.Value);
        var value = parallel ? SeriesParallel.Parallel(r1, r2) : SeriesParallel.Series(r1, r2);
        var u = SeriesParallel.WorstCaseUncertainty(
            parallel,
            r1,
            a.Value.ExpandedTransfer,
            r2,
            b.Value.ExpandedTransfer
        );
        return new Option(build, i, j, value, u);
    }

    public PositionFill ToFill(string position, IReadOnlyList<PartCandidate> parts) =>
        new(position, Build, B >= 0 ? [parts[A], parts[B]] : [parts[A]], Value, Uncertainty);
}

/// <summary>The parts that can serve a recipe, and every option for each position.</summary>
internal sealed class CandidatePool
{
    public CandidatePool(Recipe recipe, IReadOnlyList<PartCandidate> parts, AssemblyOptions options, bool withPairs)
    {
        foreach (var p in parts)
        {
            (recipe.Positions.Any(pos => Wanted(pos, p.Nominal, options)) ? Usable : Unusable).Add(p);
        }

        Options = recipe.Positions.Select(pos => Build(pos, options, withPairs)).ToArray();
    }

    public List<PartCandidate> Usable { get; } = [];

    public List<PartCandidate> Unusable { get; } = [];

    public IReadOnlyList<Option>[] Options { get; }

    public static bool Wanted(PositionSpec pos, double nominal, AssemblyOptions o) =>
        o.SameNominal(nominal, pos.Nominal)
        || (pos.Pairs.HasFlag(PairBuilds.Series) && o.SameNominal(nominal, pos.Nominal / 2))
        || (pos.Pairs.HasFlag(PairBuilds.Parallel) && o.SameNominal(nominal, pos.Nominal * 2));

    private List<Option> Build(PositionSpec pos, AssemblyOptions o, bool withPairs)
    {
        var result = new List<Option>();
        for (var i = 0; i < Usable.Count; i++)
        {
            if (o.SameNominal(Usable[i].Nominal, pos.Nominal))
            {
                result.Add(Option.Single(i, Usable[i]));
            }
        }

        foreach (var build in new[] { PositionBuild.Series, PositionBuild.Parallel })
        {
            var flag = build == PositionBuild.Series ? PairBuilds.Series : PairBuilds.Parallel;
            if (!withPairs || !pos.Pairs.HasFlag(flag))
            {
                continue;
            }

            var partNominal = PositionSpec.PartNominal(pos.Nominal, build);
            var idx = Enumerable
                .Range(0, Usable.Count)
                .Where(i => o.SameNominal(Usable[i].Nominal, partNominal))
                .ToList();
            for (var x = 0; x < idx.Count; x++)
            {
                for (var y = x + 1; y < idx.Count; y++)
                {
                    result.Add(Option.Pair(build, idx[x], Usable[idx[x]], idx[y], Usable[idx[y]]));
                }
            }
        }

        return result;
    }
}
