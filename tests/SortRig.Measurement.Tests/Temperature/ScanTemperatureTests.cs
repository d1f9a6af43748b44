using SortRig.Measurement.Readings;
using SortRig.Measurement.Temperature;

namespace SortRig.Measurement.Tests.Temperature;

public sealed class ScanTemperatureTests
{
    private static readonly DateTimeOffset s_t0 = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);

    [Theory]
    // IEC 60751:2008 Table 1: a Pt100 reads 100.00 ohm at 0 degC and 138.51 ohm at 100 degC.
    [InlineData(100.00, 0)]
    [InlineData(138.51, 100)]
    public void Celsius_TableResistance_GivesTheTableTemperature(double ohms, double celsius) =>
        Assert.Equal(celsius, ScanTemperature.Celsius(Reading.Finite(ohms, s_t0, 1000))!.Value, 1);

    [Fact]
    public void Celsius_OverloadOrOutsideTheSensorsRange_IsNull()
    {
        // IEC 60751 covers -200..850 degC (18.52..390.48 ohm); 5 ohm and 1 kohm lie outside it.
        Assert.Null(ScanTemperature.Celsius(Reading.Overload(s_t0, 1000)));
        Assert.Null(ScanTemperature.Celsius(Reading.Finite(5, s_t0, 1000)));
        Assert.Null(ScanTemperature.Celsius(Reading.Finite(1000, s_t0, 1000)));
    }

    [Fact]
    public void Interpolate_BetweenTwoReadings_IsLinearInTime()
    {
        // Textbook identity: linear interpolation, a quarter of the way from 20 to 24 degC is 21 degC.
        var before = (Reading.Finite(107.79, s_t0, 1000), (double?)20.0);
        var after = (Reading.Finite(109.35, s_t0.AddSeconds(40), 1000), (double?)24.0);
        Assert.Equal(21.0, ScanTemperature.Interpolate(before, after, s_t0.AddSeconds(10))!.Value, 12);
        Assert.Equal(20.0, ScanTemperature.Interpolate(before, after, s_t0)!.Value, 12);
        Assert.Equal(24.0, ScanTemperature.Interpolate(before, after, s_t0.AddSeconds(40))!.Value, 12);
    }

    [Fact]
    public void Interpolate_OneSideMissing_TakesTheOther()
    {
        var known = (Reading.Finite(107.79, s_t0, 1000), (double?)20.0);
        var unusable = (Reading.Overload(s_t0.AddSeconds(40), 1000), (double?)null);
        Assert.Equal(20.0, ScanTemperature.Interpolate(known, unusable, s_t0.AddSeconds(10)));
        Assert.Equal(20.0, ScanTemperature.Interpolate(unusable, known, s_t0.AddSeconds(10)));
        Assert.Null(ScanTemperature.Interpolate(unusable, unusable, s_t0.AddSeconds(10)));
        Assert.Null(ScanTemperature.Interpolate(null, null, s_t0));
    }

    [Fact]
    public void Interpolate_BothAtOneInstant_IsTheirMean()
    {
        var before = (Reading.Finite(107.79, s_t0, 1000), (double?)20.0);
        var after = (Reading.Finite(109.35, s_t0, 1000), (double?)24.0);
        Assert.Equal(22.0, ScanTemperature.Interpolate(before, after, s_t0)!.Value, 12);
    }
}
