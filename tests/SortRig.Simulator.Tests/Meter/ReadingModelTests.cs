using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Tests.Meter;

public sealed class ReadingModelTests
{
    private static readonly NplcSetting s_oneNplc = NplcSetting.Find(1)!;

    [Fact]
    public void Report_Open_IsScpiOverflow() =>
        Assert.Equal(9.9e37, ReadingModel.Report(true, double.PositiveInfinity, 1e4, s_oneNplc, 0, 0));

    [Theory]
    // Over-range 1.25 × full scale (our own envelope, docs/simulator.md): 12 500 Ohm on the 10 kOhm range.
    [InlineData(12_499.99, false)]
    [InlineData(12_500.02, true)]
    public void Report_AboveOnePointTwoFiveTimesRange_IsOverflow(double ohms, bool overflow)
    {
        var value = ReadingModel.Report(false, ohms, 1e4, s_oneNplc, 0, 0);

        Assert.Equal(overflow, value == 9.9e37);
    }

    [Fact]
    public void Report_RoundsToTheStepOfTheRange()
    {
        // 1 NPLC: 1 ppm of the 10 kOhm range = 0.01 ohm step (docs/simulator.md resolution table).
        Assert.Equal(10_000.12, ReadingModel.Report(false, 10_000.1234, 1e4, s_oneNplc, 0, 0), 9);
    }

    [Fact]
    public void Report_AddsNoiseInPpmOfRange()
    {
        // 0.7 ppm of 10 kOhm at 1 NPLC is 0.007 ohm; a +2 sigma draw adds 0.014, rounded to the 0.01 ohm step.
        Assert.Equal(10_000.01, ReadingModel.Report(false, 10_000, 1e4, s_oneNplc, 2, 0), 9);
    }
}
