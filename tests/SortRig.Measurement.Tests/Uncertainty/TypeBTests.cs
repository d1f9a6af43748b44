using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class TypeBTests
{
    [Fact]
    public void Rectangular_HalfWidth_IsDividedByRootThree()
    {
        // JCGM 100:2008 4.3.7, eq. (7): u² = a²/3. For a = 1: u = 0.57735 (1/√3).
        Assert.Equal(0.5773503, TypeB.Rectangular(1.0), 7);
        // JCGM 100:2008 H.1.3.5 (from memory): bounds ±0.05 degC on the temperature difference give u = 0.029 degC.
        Assert.Equal(0.029, TypeB.Rectangular(0.05), 3);
    }

    [Fact]
    public void Triangular_HalfWidth_IsDividedByRootSix()
    {
        // JCGM 100:2008 4.3.9: symmetric triangular distribution, u² = a²/6. For a = 1: u = 0.40825.
        Assert.Equal(0.4082483, TypeB.Triangular(1.0), 7);
    }

    [Fact]
    public void FromExpanded_CertificateWithK3_GivesStandardUncertainty()
    {
        // JCGM 100:2008 H.1.3.1 (from memory): certificate U = 0.075 µm with k = 3 gives u(l_s) = 25 nm.
        Assert.Equal(25.0, TypeB.FromExpanded(75.0, 3.0), 9);
    }

    [Theory]
    [InlineData(-1.0)]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    public void Rectangular_InvalidHalfWidth_Throws(double halfWidth)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => TypeB.Rectangular(halfWidth));
        Assert.Equal("halfWidth", ex.ParamName);
    }
}
