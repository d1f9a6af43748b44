using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class TypeATests
{
    [Fact]
    public void StandardUncertaintyOfMean_NistNumAcc1_IsCertifiedSdOverRootN()
    {
        // NIST StRD univariate data set NumAcc1 (certified sample standard deviation s = 1, from memory):
        // 10000001, 10000003, 10000002. The mean's standard uncertainty is s/√n = 1/√3 (JCGM 100:2008 eq. 5).
        var u = TypeA.StandardUncertaintyOfMean([10000001.0, 10000003.0, 10000002.0]);
        Assert.Equal(1.0 / Math.Sqrt(3.0), u, 9);
    }

    [Fact]
    public void StandardUncertaintyOfMean_HandComputedSet_Matches()
    {
        // 1..5: mean 3, Σ(x - 3)² = 10, s² = 10/4 = 2.5, s/√5 = √0.5 = 0.70711 (hand arithmetic).
        Assert.Equal(Math.Sqrt(0.5), TypeA.StandardUncertaintyOfMean([1.0, 2.0, 3.0, 4.0, 5.0]), 12);
    }

    [Fact]
    public void Component_CarriesNMinusOneDegreesOfFreedom()
    {
        // JCGM 100:2008 G.3.3: ν = n − 1 for the mean of n independent observations.
        var c = TypeA.Component("repeat", [1.0, 2.0, 3.0, 4.0, 5.0]);
        Assert.Equal(4.0, c.DegreesOfFreedom);
        Assert.Equal(UncertaintyKind.TypeA, c.Kind);
    }

    [Fact]
    public void StandardUncertaintyOfMean_OneValue_Throws()
    {
        var ex = Assert.Throws<ArgumentException>(() => TypeA.StandardUncertaintyOfMean([1.0]));
        Assert.Contains("at least 2", ex.Message, StringComparison.Ordinal);
    }
}
