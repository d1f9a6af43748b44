using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using SortRig.Measurement.Temperature;

namespace SortRig.Measurement.Tests.Temperature;

public sealed class CallendarVanDusenTests
{
    // IEC 60751:2008 Table 1 (Pt100 temperature/resistance table, ohms to 0.01).
    // Figures recalled from memory; each was checked against the standard's own equation
    // (IEC 60751 sec. 4.2 with A, B, C of the standard) before being written here: all agree to
    // within half of the last printed digit.
    public static TheoryData<double, double> Iec60751Table =>
        new()
        {
            { -200, 18.52 },
            { -100, 60.26 },
            { 0, 100.00 },
            { 100, 138.51 },
            { 200, 175.86 },
            { 300, 212.05 },
            { 400, 247.09 },
            { 500, 280.98 },
            { 600, 313.71 },
            { 700, 345.28 },
            { 800, 375.70 },
            { 850, 390.48 },
        };

    [Theory]
    [MemberData(nameof(Iec60751Table))]
    public void Resistance_AtTableTemperature_MatchesIecTableToItsPrintedDigits(double celsius, double tableOhms)
    {
        Assert.InRange(Pt100.Resistance(celsius), tableOhms - 0.0051, tableOhms + 0.0051);
    }

    [Theory]
    [MemberData(nameof(Iec60751Table))]
    public void Temperature_OfTableResistance_GivesTableTemperatureWithinRounding(double celsius, double tableOhms)
    {
        // 0.005 ohm of table rounding is at most 0.005 / 0.29 ohm/K = 0.018 K at 850 degC.
        Assert.InRange(Pt100.Temperature(tableOhms), celsius - 0.02, celsius + 0.02);
    }

    [Fact]
    public void Resistance_At100C_EqualsHandEvaluatedPolynomial()
    {
        // Worked by hand: 100 * (1 + 3.9083e-3 * 100 - 5.775e-7 * 100^2) = 100 * 1.385055 = 138.5055 ohm.
        Assert.Equal(138.5055, Pt100.Resistance(100), 10);
    }

    [Fact]
    public void Resistance_AtMinus100C_IncludesTheCTerm()
    {
        // Worked by hand: 1 - 0.39083 - 0.005775 + (-4.183e-12)(-200)(-1e6) = 0.603395 - 0.0008366 = 0.6025584.
        Assert.Equal(60.25584, Pt100.Resistance(-100), 8);
    }

    [Fact]
    public void Pt1000_IsTenTimesPt100()
    {
        Assert.Equal(1000.0, CallendarVanDusen.Pt1000.Resistance(0), 10);
        Assert.Equal(10 * Pt100.Resistance(-150), CallendarVanDusen.Pt1000.Resistance(-150), 9);
        Assert.Equal(-150, CallendarVanDusen.Pt1000.Temperature(10 * Pt100.Resistance(-150)), 9);
    }

    [Property(MaxTest = 300)]
    public Property Temperature_OfResistance_RoundTripsOverIecRange()
    {
        // -200.000 .. 850.000 degC in millikelvin steps.
        Arbitrary<double> celsius = Gen.Choose(-200_000, 850_000).Select(mk => mk / 1000.0).ToArbitrary();
        return Prop.ForAll(celsius, t => Math.Abs(Pt100.Temperature(Pt100.Resistance(t)) - t) < 1e-8);
    }

    [Fact]
    public void Resistance_IsContinuousAcrossZero()
    {
        Assert.Equal(Pt100.Resistance(0), Pt100.Resistance(-1e-9), 6);
        Assert.Equal(0, Pt100.Temperature(100.0), 12);
        Assert.True(Pt100.Temperature(99.9999) < 0);
    }

    [Fact]
    public void Resistance_OutsideRange_ThrowsNamingTheRange()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Pt100.Resistance(851));
        Assert.Contains("-200..850", ex.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => Pt100.Temperature(10.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => Pt100.Temperature(double.NaN));
    }

    [Fact]
    public void Constructor_NonPositiveR0_ThrowsNamingR0()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new CallendarVanDusen(0));
        Assert.Equal("r0", ex.ParamName);
    }
}
