using SortRig.Engine.Building;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;

namespace SortRig.Engine.Tests.Building;

/// <summary>Which parts cannot help a build, against hand-worked edges of the matched-form rule
/// (docs/planning.md).</summary>
public sealed class PartUseTests
{
    private static PartUse Judge(double nominal, double ppm, double expandedPpm = 20) =>
        PartUse.Judge(
            BuildParts.Quad,
            nominal,
            new MeasuredValue(
                nominal * (1 + (ppm * 1e-6)),
                nominal * expandedPpm * 1e-6 / 2,
                nominal * expandedPpm * 1e-6 / 2
            ),
            0.01,
            new AssemblyOptions()
        );

    // Hand-worked: stock ±1 % and 1000 ppm match: a partner at +1 % admits parts up to (1.01)(1.001) − 1 ≈ +11 010 ppm
    // less the part's own U (20 ppm): +10 900 helps, +11 100 cannot.
    [Theory]
    [InlineData(0, true)]
    [InlineData(9_900, true)]
    [InlineData(10_900, true)]
    [InlineData(11_100, false)]
    [InlineData(-10_900, true)]
    [InlineData(-11_100, false)]
    public void Matched_OutsideTheStockBandAndTheMatch_CannotHelp(double ppm, bool helps)
    {
        var use = Judge(10_000, ppm);
        Assert.Equal(helps, use.Helps);
        Assert.Equal(helps, use.Reason.Length == 0);
    }

    // A part whose own expanded uncertainty spans more than the 1000 ppm window fits no set (U = 600 ppm: 1200 ppm
    // wide).
    [Fact]
    public void Matched_UncertaintyWiderThanTheMatch_CannotHelp() => Assert.False(Judge(10_000, 0, 600).Helps);

    // A nominal no position takes.
    [Fact]
    public void OtherNominal_CannotHelp() => Assert.Contains("takes", Judge(4_700, 0).Reason, StringComparison.Ordinal);
}
