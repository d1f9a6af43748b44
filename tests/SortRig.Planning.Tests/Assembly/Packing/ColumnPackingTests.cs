using SortRig.Planning.Assembly.Packing;

namespace SortRig.Planning.Tests.Assembly.Packing;

/// <summary>
/// The local search over a pool of sets (<see cref="ColumnPacking"/>): its packing is always pairwise disjoint, and on
/// pools small enough for a brute force over every subset it reaches the maximum (the referee).
/// </summary>
public sealed class ColumnPackingTests
{
    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 40));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void ReachesTheBruteForceMaximum(int seed)
    {
        var rng = new Random(41_000 + seed);
        var rows = rng.Next(8, 16);
        var pool = Enumerable
            .Range(0, rng.Next(6, 16))
            .Select(_ => Enumerable.Range(0, rows).OrderBy(_ => rng.Next()).Take(rng.Next(2, 5)).Order().ToArray())
            .ToArray();
        var best = 0;
        for (var mask = 0; mask < 1 << pool.Length; mask++)
        {
            var chosen = Enumerable.Range(0, pool.Length).Where(k => (mask >> k & 1) == 1).ToList();
            if (chosen.Count > best && Disjoint(pool, chosen))
            {
                best = chosen.Count;
            }
        }

        var calls = 0;
        var packing = new ColumnPacking(pool, rows, seed).Solve([], int.MaxValue, () => ++calls > 200);
        Assert.True(Disjoint(pool, packing), $"seed {seed}: overlapping sets");
        Assert.Equal(best, packing.Count);
    }

    [Fact]
    public void NeedsATwoForOneSwap_FromAPoorStart()
    {
        // Parts 0..3; starting from the set of all four, which blocks {0,1} and {2,3}, a swap must put both in.
        int[][] pool =
        [
            [0, 1, 2, 3],
            [0, 1],
            [2, 3],
        ];
        var packing = new ColumnPacking(pool, 4).Solve([0], 2, () => false);
        Assert.Equal([1, 2], packing.Order());
    }

    private static bool Disjoint(int[][] pool, IEnumerable<int> chosen)
    {
        var used = new HashSet<int>();
        return chosen.All(k => pool[k].All(used.Add));
    }
}
