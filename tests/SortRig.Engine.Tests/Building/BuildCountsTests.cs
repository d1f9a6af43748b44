using SortRig.Engine.Building;
using SortRig.Planning.Assembly;

namespace SortRig.Engine.Tests.Building;

/// <summary>The count bounds of a build against hand counts of the positions and parts (each figure worked by hand
/// below).</summary>
public sealed class BuildCountsTests
{
    private static readonly AssemblyOptions s_options = new();

    // Hand count: two quads need 8 parts of 10k; 5 on hand, so at least 3 more; 5 parts hold at most 1 set.
    [Fact]
    public void Quad_TwoSets_FivePartsOnHand_ThreeMore()
    {
        var count = BuildCounts.Count(BuildParts.Quad, 2, Enumerable.Repeat(10_000.0, 5).ToList(), s_options);
        Assert.Equal(1, count.SetsBound);
        Assert.Equal(3, count.MoreAtLeast);
        var need = Assert.Single(count.Needs);
        Assert.Equal((10_000.0, 8, 5.0, 3), (need.Nominal, need.Wanted, need.OnHand, need.StillNeeded));
    }

    // Hand count, R-2R shape (5 × 10k, 7 × 20k or two 10k in series each), one set, ten 10k parts: five fill the
    // 10k positions, the other five make two series pairs and half of a third, 2.5 of the 7 20k fills; 4.5 fills
    // short and a part gives at most one, so at least 5 more parts (five 20k, or four 20k and one 10k).
    [Fact]
    public void Ladder_TenOfTheSmallNominal_FiveMoreAtLeast()
    {
        var count = BuildCounts.Count(BuildParts.Ladder8, 1, Enumerable.Repeat(10_000.0, 10).ToList(), s_options);
        Assert.Equal(5, count.MoreAtLeast);
        Assert.Equal(0, count.SetsBound);
        Assert.Equal([0, 5], count.Needs.Select(n => n.StillNeeded));
        Assert.Equal([5.0, 2.5], count.Needs.Select(n => n.OnHand));
        Assert.Equal([10_000.0, 20_000.0], count.Needs.Select(n => n.Nominal));
    }

    // Hand count: 5 singles + 7 series pairs = 19 parts of 10k make one ladder by counts; 18 are one part short.
    [Theory]
    [InlineData(19, 0, 1)]
    [InlineData(18, 1, 0)]
    public void Ladder_AllFromTheSmallNominal_NineteenParts(int parts, int more, int bound)
    {
        var count = BuildCounts.Count(BuildParts.Ladder8, 1, Enumerable.Repeat(10_000.0, parts).ToList(), s_options);
        Assert.Equal(more, count.MoreAtLeast);
        Assert.Equal(bound, count.SetsBound);
    }

    // Hand count: a part of a nominal no position takes (4.7k) adds nothing; 3 of each wanted nominal for two
    // ladder-pair sets (4 of each wanted) leaves 1 + 1 short.
    [Fact]
    public void LadderPair_OtherNominalsCountForNothing()
    {
        var nominals = new List<double> { 10_000, 10_000, 10_000, 20_000, 20_000, 20_000, 4_700, 4_700 };
        var count = BuildCounts.Count(BuildParts.LadderPair, 2, nominals, s_options);
        Assert.Equal(2, count.MoreAtLeast);
        Assert.Equal([1, 1], count.Needs.Select(n => n.StillNeeded));
        Assert.Equal(1, count.SetsBound);
    }

    // Property (monotone supply, common practice, no source): one more wanted part lowers what is still needed by at
    // most one and never raises it.
    [Fact]
    public void MorePartsNeverNeedMore()
    {
        var random = new Random(20);
        for (var trial = 0; trial < 500; trial++)
        {
            var nominals = Enumerable
                .Range(0, random.Next(0, 30))
                .Select(_ => random.Next(2) == 0 ? 10_000.0 : 20_000.0)
                .ToList();
            var before = BuildCounts.Count(BuildParts.Ladder8, 1 + random.Next(3), nominals, s_options);
            var after = BuildCounts.Count(
                BuildParts.Ladder8,
                before.Needs.Sum(n => n.Wanted) / 12,
                [.. nominals, 10_000.0],
                s_options
            );
            Assert.InRange(after.MoreAtLeast, Math.Max(0, before.MoreAtLeast - 1), before.MoreAtLeast);
        }
    }
}
