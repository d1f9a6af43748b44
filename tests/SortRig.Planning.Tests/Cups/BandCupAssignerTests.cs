using SortRig.Planning.Cups;
using static SortRig.Planning.Tests.Cups.CupAssignerContractTests;

namespace SortRig.Planning.Tests.Cups;

public sealed class BandCupAssignerTests
{
    private static BandCupAssigner Four(int perSet = 2) => new(new BandCupOptions(4, 1000, 10e3, 1.0, perSet));

    [Theory]
    [InlineData(-1500, "A")]
    [InlineData(-1, "B")]
    [InlineData(0, "C")]
    [InlineData(500, "C")]
    [InlineData(1999, "D")]
    [InlineData(2500, "R")]
    [InlineData(-2001, "R")]
    public void Bands_AreMatchToleranceWide_AndCentredOnNominal(double ppm, string cup)
    {
        // K = 4 bands of 1000 ppm centred on nominal: [-2000,-1000) A, [-1000,0) B, [0,1000) C, [1000,2000) D.
        Assert.Equal(cup, Four().Assign(Part(1, 10e3, ppm)).CupLabel);
    }

    [Fact]
    public void OutOfToleranceOtherNominalOrUncertainParts_GoToReject_WithTheReason()
    {
        var a = Four();
        Assert.Contains("stock tolerance", a.Assign(Part(1, 10e3, 15_000)).Reason, StringComparison.Ordinal);
        Assert.Contains("reel", a.Assign(Part(2, 20e3, 0)).Reason, StringComparison.Ordinal);
        var d = a.Assign(Part(3, 10e3, 0, uPpm: 900));
        Assert.True(d.IsReject);
        Assert.Equal(4, d.CupIndex);
        Assert.Contains("uncertainty", d.Reason, StringComparison.Ordinal);
        Assert.Equal(3, a.Counts.Single(c => c.IsReject).Count);
    }

    [Fact]
    public void CompletesSet_OnEveryWholeSetInACup()
    {
        var a = Four(perSet: 2);
        Assert.Equal(
            [false, true, false, true],
            Enumerable.Range(1, 4).Select(n => a.Assign(Part(n, 10e3, 100 + n)).CompletesSet)
        );
        Assert.Equal(2, a.Counts.Single(c => c.CupLabel == "C").SetsReady);
    }

    [Fact]
    public void Labels_SkipIOAndR()
    {
        Assert.Equal(
            "ABCDEFGHJKLMNPQSTUVWXYZ",
            string.Concat(Enumerable.Range(0, CupLabels.MaxCups).Select(CupLabels.For))
        );
    }

    [Fact]
    public void Options_OutOfRange_NameTheOption()
    {
        Assert.Equal(
            "cupCount",
            Assert.Throws<ArgumentOutOfRangeException>(() => new BandCupOptions(24, 1000, 10e3, 1)).ParamName
        );
        Assert.Equal(
            "nominal",
            Assert.Throws<ArgumentOutOfRangeException>(() => new BandCupOptions(8, 1000, -1, 1)).ParamName
        );
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(-1.0)]
    [InlineData(100_001.0)]
    public void Options_UncertaintyLimitOutsideItsRange_IsRefusedByBothPlanners(double limit)
    {
        // Both planners check the shared ranges in one place (CupOptionRules): a NaN limit is refused too.
        Assert.Equal(
            "uncertaintyLimitPpm",
            Assert
                .Throws<ArgumentOutOfRangeException>(() =>
                    new BandCupOptions(8, 1000, 10e3, 1, uncertaintyLimitPpm: limit)
                )
                .ParamName
        );
        Assert.Equal(
            "uncertaintyLimitPpm",
            Assert
                .Throws<ArgumentOutOfRangeException>(() =>
                    new AdaptiveCupOptions(
                        8,
                        1000,
                        1,
                        new Dictionary<double, int> { [10e3] = 4 },
                        uncertaintyLimitPpm: limit
                    )
                )
                .ParamName
        );
    }
}
