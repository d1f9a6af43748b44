using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

public sealed class WindowCoverTests
{
    // Referee: exhaustive enumeration of every set of window starts (bit masks over the grid), keeping the sets with
    // at most `count` windows, all allowed and pairwise at least `span` apart (textbook: the exact optimum of a small
    // weighted interval packing by enumeration).
    private static double Exhaustive(double[] gain, int span, bool[] allowed, int count)
    {
        var best = 0.0;
        for (var mask = 0; mask < 1 << gain.Length; mask++)
        {
            var starts = Enumerable.Range(0, gain.Length).Where(i => (mask & (1 << i)) != 0).ToList();
            if (
                starts.Count <= count
                && starts.All(i => allowed[i])
                && starts.Zip(starts.Skip(1)).All(p => p.Second - p.First >= span)
            )
            {
                best = Math.Max(best, starts.Sum(i => gain[i]));
            }
        }

        return best;
    }

    [Fact]
    public void Best_MatchesExhaustiveEnumeration_OnSmallGrids()
    {
        var rng = new Random(2026);
        for (var trial = 0; trial < 400; trial++)
        {
            var n = rng.Next(1, 13);
            var gain = Enumerable
                .Range(0, n)
                .Select(_ => rng.Next(4) == 0 ? 0 : Math.Round(rng.NextDouble() * 10, 2))
                .ToArray();
            var allowed = Enumerable.Range(0, n).Select(_ => rng.Next(5) != 0).ToArray();
            var span = rng.Next(1, 5);
            var count = rng.Next(0, 5);

            var (starts, total) = WindowCover.Best(gain, span, allowed, count);

            var expected = Exhaustive(gain, span, allowed, count);
            Assert.Equal(expected, total, 9);
            Assert.Equal(expected, starts.Sum(i => gain[i]), 9);
            Assert.True(starts.Count <= count);
            Assert.All(starts, i => Assert.True(allowed[i]));
            Assert.All(starts.Zip(starts.Skip(1)), p => Assert.True(p.Second - p.First >= span));
        }
    }

    [Fact]
    public void Best_PrefersTwoGoodWindows_ToTheLargestSingleStart()
    {
        // Span 3: the largest start (2, worth 6) leaves room only for a worthless window; 1 + 4 (5 + 5) is better.
        double[] gain = [0, 5, 6, 0, 5, 0];
        var (starts, total) = WindowCover.Best(gain, 3, [.. gain.Select(_ => true)], 2);
        Assert.Equal(10, total, 9);
        Assert.Equal([1, 4], starts);
    }
}
