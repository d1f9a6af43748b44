using SortRig.Measurement.Readings;
using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class ResistanceUncertaintyTests
{
    private static readonly DateTimeOffset s_start = new(2025, 3, 1, 9, 0, 0, TimeSpan.Zero);

    // Eight readings of a 10 kOhm part, 42 ms apart (1 NPLC at 24 rdg/s: 1/24 s = 41.7 ms).
    private static readonly double[] s_values =
    [
        10000.012,
        10000.018,
        10000.015,
        10000.011,
        10000.019,
        10000.014,
        10000.016,
        10000.015,
    ];

    private static Reading[] Readings() =>
        s_values.Select((v, i) => Reading.Finite(v, s_start.AddMilliseconds(42 * i), 10_000)).ToArray();

    [Fact]
    public void PercentOfReading_OnTenKilohm_MatchesTradeArithmetic()
    {
        // Common practice, no source: 1 % of 10 kOhm is 100 Ohm, 0.1 % is 10 Ohm.
        Assert.Equal(100.0, new AccuracySpec(1.0, 0).HalfWidth(10_000, 10_000), 9);
        Assert.Equal(10.0, new AccuracySpec(0.1, 0).HalfWidth(10_000, 10_000), 9);
    }

    [Fact]
    public void For_TenKilohmWindow_CombinesTypeASpecAndResolution()
    {
        var value = ResistanceUncertainty.For(Readings(), InventedMeter.R10k, InventedMeter.One, SpecPeriod.Year1);

        // Hand arithmetic: mean = 80000.120/8 = 10000.015; deviations (mOhm) -3 3 0 -4 4 -1 1 0,
        // Σd² = 52e-6 Ohm², s² = 52e-6/7, u_A = s/√8 = 0.0009636 Ohm.
        var uA = Math.Sqrt(52e-6 / 7) / Math.Sqrt(8);
        // 1 y spec at 10 kOhm on the 10 kOhm range: 0.0085 % × 10000.015 + 0.0006 % × 10000 = 0.850001275 + 0.06
        // = 0.910001275 Ohm, /√3 (GUM 4.3.7).
        var uSpec = 0.910001275 / Math.Sqrt(3);
        // Resolution 1 ppm of 10 kOhm = 0.01 Ohm step; half step 0.005 Ohm, /√3.
        var uRes = 0.005 / Math.Sqrt(3);
        // Short term: 0.1 × 24 h half-width (0.0025 % × 10000.015 + 0.0004 % × 10000 = 0.250000375 + 0.04
        // = 0.290000375 Ohm), /√3.
        var uSt = 0.1 * 0.290000375 / Math.Sqrt(3);

        Assert.Equal(10000.015, value.Value, 9);
        Assert.Equal(Math.Sqrt((uA * uA) + (uSpec * uSpec) + (uRes * uRes)), value.StandardUncertainty, 9);
        Assert.Equal(Math.Sqrt((uA * uA) + (uRes * uRes) + (uSt * uSt)), value.TransferUncertainty, 9);
        Assert.Equal(2.0, value.CoverageFactor);
        Assert.True(value.TransferUncertainty <= value.StandardUncertainty);
    }

    [Fact]
    public void For_TwoWire_AddsLeadVariation()
    {
        var four = ResistanceUncertainty.For(Readings(), InventedMeter.R10k, InventedMeter.One, SpecPeriod.Year1);
        var two = ResistanceUncertainty.For(
            Readings(),
            InventedMeter.R10k,
            InventedMeter.One,
            SpecPeriod.Year1,
            fourWire: false
        );

        // Lead and contact variation 0.1 Ohm (default, from memory) as a rectangular half-width: 0.0577 Ohm.
        var uLead = 0.1 / Math.Sqrt(3);
        Assert.Equal(
            Math.Sqrt((four.TransferUncertainty * four.TransferUncertainty) + (uLead * uLead)),
            two.TransferUncertainty,
            9
        );
    }

    [Fact]
    public void For_OverloadInWindow_ThrowsNamingTheReading()
    {
        var readings = Readings();
        readings[3] = Reading.Overload(readings[3].Time, 10_000);
        var ex = Assert.Throws<ArgumentException>(() =>
            ResistanceUncertainty.For(readings, InventedMeter.R10k, InventedMeter.One, SpecPeriod.Year1)
        );
        Assert.Contains("Reading 3", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void AbsoluteBudget_TwentyFourHourSpec_IsSmallerThanOneYear()
    {
        var day = ResistanceUncertainty.AbsoluteBudget(
            Readings(),
            InventedMeter.R10k,
            InventedMeter.One,
            SpecPeriod.Hours24
        );
        var year = ResistanceUncertainty.AbsoluteBudget(
            Readings(),
            InventedMeter.R10k,
            InventedMeter.One,
            SpecPeriod.Year1
        );
        Assert.True(day.CombinedStandardUncertainty < year.CombinedStandardUncertainty);
        Assert.Equal(3, year.Components.Count);
    }
}
