using SortRig.Planning.Assembly.Packing;

namespace SortRig.Planning.Tests.Assembly.Packing;

/// <summary>
/// Algorithm X on dancing links (<see cref="ExactCover"/>) against the worked example of Knuth's "Dancing Links" (2000;
/// the 7-item, 6-option matrix, from memory) and against a brute force over every subset of options on random small
/// instances with secondary items.
/// </summary>
public sealed class ExactCoverTests
{
    [Fact]
    public void KnuthExample_HasItsUniqueCover()
    {
        // Items A..G = 0..6; the options of the paper's example; its unique cover is {A,D}, {C,E,F}, {B,G}.
        int[][] options =
        [
            [2, 4, 5],
            [0, 3, 6],
            [1, 2, 5],
            [0, 3],
            [1, 6],
            [3, 4, 6],
        ];
        var cover = new ExactCover(7, _ => true, options).Solve(() => false, out var complete);
        Assert.True(complete);
        Assert.NotNull(cover);
        Assert.Equal([0, 3, 4], cover.Order());
    }

    [Fact]
    public void NoCover_IsReportedComplete()
    {
        // Item 2 lies only in an option that also holds item 0, which another option needs for item 1's cover.
        int[][] options =
        [
            [0, 2],
            [0, 1],
        ];
        var cover = new ExactCover(3, _ => true, options).Solve(() => false, out var complete);
        Assert.Null(cover);
        Assert.True(complete);
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 60));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void AgreesWithBruteForce(int seed)
    {
        var rng = new Random(31_000 + seed);
        var items = rng.Next(4, 10);
        var primary = Enumerable.Range(0, items).Select(_ => rng.Next(3) > 0).ToArray();
        var options = Enumerable
            .Range(0, rng.Next(3, 13))
            .Select(_ => Enumerable.Range(0, items).Where(_ => rng.Next(3) == 0).ToArray())
            .Where(o => o.Length > 0)
            .ToArray();
        var exists = false;
        for (var mask = 0; mask < 1 << options.Length && !exists; mask++)
        {
            exists = IsCover(
                items,
                primary,
                options,
                Enumerable.Range(0, options.Length).Where(k => (mask >> k & 1) == 1)
            );
        }

        var cover = new ExactCover(items, i => primary[i], options).Solve(() => false, out var complete);
        Assert.True(complete);
        Assert.Equal(exists, cover is not null);
        if (cover is not null)
        {
            Assert.True(IsCover(items, primary, options, cover), $"seed {seed}: not an exact cover");
        }
    }

    [Fact]
    public void Stop_EndsTheSearchIncomplete()
    {
        // Every pair of 15 items: an odd number of items has no perfect matching, and Algorithm X tries them all
        // (13!! = 135 135 ways to pair the rest) unless stopped; the stop is first asked after 1 024 nodes.
        var options = PairsOf(15);
        var stopped = new ExactCover(15, _ => true, options);
        Assert.Null(stopped.Solve(() => true, out var complete));
        Assert.False(complete);
        Assert.Equal(1024, stopped.Nodes);

        var full = new ExactCover(15, _ => true, options);
        Assert.Null(full.Solve(() => false, out complete));
        Assert.True(complete);
        Assert.True(full.Nodes > 100_000, $"{full.Nodes} nodes");
    }

    private static int[][] PairsOf(int n) =>
        [.. from a in Enumerable.Range(0, n) from b in Enumerable.Range(a + 1, n - a - 1) select new[] { a, b }];

    private static bool IsCover(int items, bool[] primary, int[][] options, IEnumerable<int> chosen)
    {
        var count = new int[items];
        foreach (var k in chosen)
        {
            foreach (var i in options[k])
            {
                count[i]++;
            }
        }

        return Enumerable.Range(0, items).All(i => primary[i] ? count[i] == 1 : count[i] <= 1);
    }
}
