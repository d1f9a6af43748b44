using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

public sealed class WindowCoverTests
{
    // A small random grid of window gains: 1 to 12 points, a quarter of them worthless.
    private static double[] RandomGains(Random rng) =>
        [
            .. Enumerable
                .Range(0, rng.Next(1, 13))
                .Select(_ => rng.Next(4) == 0 ? 0 : Math.Round(rng.NextDouble() * 10, 2)),
        ];

    // Every subset of the grid's starts, ascending (bit masks).
    private static IEnumerable<List<int>> AllStarts(int n)
    {
        for (var mask = 0; mask < 1 << n; mask++)
        {
            yield return [.. Enumerable.Range(0, n).Where(i => (mask & (1 << i)) != 0)];
        }
    }

    // Referee: exhaustive enumeration of every set of window starts (bit masks over the grid), keeping the sets with
    // at most `count` windows, all allowed and pairwise at least `span` apart (textbook: the exact optimum of a small
    // weighted interval packing by enumeration).
    private static double Exhaustive(double[] gain, int span, bool[] allowed, int count)
    {
        var best = 0.0;
        foreach (var starts in AllStarts(gain.Length))
        {
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
            var gain = RandomGains(rng);
            var n = gain.Length;
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

    // Referee for BestOverlapping: every set of allowed starts with consecutive starts at least `span` apart or exactly
    // `span` − 1 apart (one step of overlap), at most `count` of them; a window overlapping the previous one is worth
    // its gain less its shared part (exhaustive enumeration, textbook).
    private static double ExhaustiveOverlapping(double[] gain, double[] shared, int span, bool[] allowed, int count)
    {
        var best = 0.0;
        foreach (var starts in AllStarts(gain.Length))
        {
            var pairs = starts.Zip(starts.Skip(1)).ToList();
            if (starts.Count <= count && starts.All(i => allowed[i]) && pairs.All(p => p.Second - p.First >= span - 1))
            {
                var total =
                    starts.Sum(i => gain[i])
                    - pairs.Where(p => p.Second - p.First == span - 1).Sum(p => shared[p.Second]);
                best = Math.Max(best, total);
            }
        }

        return best;
    }

    [Fact]
    public void BestOverlapping_MatchesExhaustiveEnumeration_OnSmallGrids()
    {
        var rng = new Random(2027);
        for (var trial = 0; trial < 400; trial++)
        {
            var gain = RandomGains(rng);
            var n = gain.Length;
            var shared = gain.Select(g => Math.Round(g * rng.NextDouble(), 2)).ToArray();
            var allowed = Enumerable.Range(0, n).Select(_ => rng.Next(5) != 0).ToArray();
            var span = rng.Next(2, 5);
            var count = rng.Next(0, 5);

            var (starts, total) = WindowCover.BestOverlapping(gain, shared, span, allowed, count);

            var expected = ExhaustiveOverlapping(gain, shared, span, allowed, count);
            Assert.Equal(expected, total, 9);
            var pairs = starts.Zip(starts.Skip(1)).ToList();
            var found =
                starts.Sum(i => gain[i]) - pairs.Where(p => p.Second - p.First == span - 1).Sum(p => shared[p.Second]);
            Assert.Equal(expected, found, 9);
            Assert.True(starts.Count <= count);
            Assert.All(starts, i => Assert.True(allowed[i]));
            Assert.All(pairs, p => Assert.True(p.Second - p.First >= span - 1));
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

    // Referee for BestAround: every set of pairwise non-overlapping starts (bit masks over the grid), and within it
    // every increasing choice of one start per required window inside its range; the other starts are free windows (at
    // most `count`, each of positive gain). The largest total, or null when no choice places every required window
    // (exhaustive enumeration of a small constrained interval packing, textbook).
    private static double? ExhaustiveAround(double[] gain, int span, int count, (int Lo, int Hi)[] required)
    {
        double? best = null;
        foreach (var starts in AllStarts(gain.Length))
        {
            if (!starts.Zip(starts.Skip(1)).All(p => p.Second - p.First >= span))
            {
                continue;
            }

            foreach (var pick in Picks(starts, required, 0, 0))
            {
                var free = starts.Where(s => !pick.Contains(s)).ToList();
                if (free.Count <= count && free.All(s => gain[s] > 0))
                {
                    var total = free.Sum(s => gain[s]) + pick.Sum(s => Math.Max(0, gain[s]));
                    best = best is null ? total : Math.Max(best.Value, total);
                }
            }
        }

        return best;

        static IEnumerable<List<int>> Picks(List<int> starts, (int Lo, int Hi)[] required, int r, int from)
        {
            if (r == required.Length)
            {
                yield return [];
                yield break;
            }

            for (var k = from; k < starts.Count; k++)
            {
                if (starts[k] >= required[r].Lo && starts[k] <= required[r].Hi)
                {
                    foreach (var rest in Picks(starts, required, r + 1, k + 1))
                    {
                        yield return [starts[k], .. rest];
                    }
                }
            }
        }
    }

    [Fact]
    public void BestAround_MatchesExhaustiveEnumeration_OnSmallGrids()
    {
        var rng = new Random(2027);
        var (placed, infeasible) = (0, 0);
        for (var trial = 0; trial < 400; trial++)
        {
            var n = rng.Next(1, 12);
            var gain = Enumerable
                .Range(0, n)
                .Select(_ => rng.Next(4) == 0 ? 0 : Math.Round(rng.NextDouble() * 10, 2))
                .ToArray();
            var span = rng.Next(1, 4);
            var count = rng.Next(0, 4);
            var required = Enumerable
                .Range(0, rng.Next(0, 3))
                .Select(_ =>
                {
                    var lo = rng.Next(n);
                    return (Lo: lo, Hi: Math.Min(n - 1, lo + rng.Next(0, 4)));
                })
                .OrderBy(r => r)
                .ToArray();

            var plan = WindowCover.BestAround(gain, span, count, required);

            var expected = ExhaustiveAround(gain, span, count, required);
            Assert.Equal(expected is null, plan is null);
            if (plan is not { } p)
            {
                infeasible++;
                continue;
            }

            placed++;
            Assert.Equal(expected!.Value, p.Total, 9);
            Assert.Equal(p.Total, p.Free.Sum(i => gain[i]) + p.Required.Sum(i => Math.Max(0, gain[i])), 9);
            Assert.True(p.Free.Count <= count);
            Assert.Equal(required.Length, p.Required.Count);
            Assert.All(required.Zip(p.Required), x => Assert.InRange(x.Second, x.First.Lo, x.First.Hi));
            var all = p.Free.Concat(p.Required).Order().ToList();
            Assert.All(all.Zip(all.Skip(1)), q => Assert.True(q.Second - q.First >= span));
        }

        // Both outcomes were exercised.
        Assert.True(placed > 100 && infeasible > 10, $"{placed} placed, {infeasible} infeasible");
    }
}
