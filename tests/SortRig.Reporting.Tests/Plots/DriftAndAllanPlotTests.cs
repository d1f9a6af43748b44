using SortRig.Measurement.Drift;
using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Tests.Plots;

public sealed class DriftAndAllanPlotTests
{
    [Fact]
    public void DriftPlot_PointsEqualInputInHoursAndPpm()
    {
        DriftSample[] samples = DemoData
            .Channel("R7", 1000, 240, 0.4, -2, 0.3, seed: 2)
            .Select((s, i) => new DriftSample(s.Time, s.Ohms, i % 2 == 0 ? s.TemperatureC : null))
            .ToArray();

        var plot = DriftPlot.Render(new DriftPlotInput("R7", samples, 1000), new PlotSize(900, 600));

        Assert.Equal(samples.Select(s => (s.Time - DemoData.Start).TotalHours), plot.Data.Hours);
        Assert.Equal(samples.Select(s => ((s.Ohms / 1000) - 1) * 1e6), plot.Data.Ppm);
        Assert.Equal(120, plot.Data.TemperatureC.Length); // only samples that carry a temperature
        Assert.Equal(
            samples.Where(s => s.TemperatureC is not null).Select(s => s.TemperatureC!.Value),
            plot.Data.TemperatureC
        );
        Assert.Equal(DemoData.Start, plot.Data.Origin);
        PngFile.AssertImage(plot.Png, 900, 600);
    }

    [Fact]
    public void AllanPlot_PointsEqualAllanDeviationOutput()
    {
        double[] y = DemoData
            .Channel("R7", 1000, 1024, 0, 0, 0.3, seed: 4, withTemperature: false)
            .Select(s => (s.Ohms - 1000) / 1000)
            .ToArray();
        IReadOnlyList<AllanPoint> expected = AllanDeviation.Overlapping(y, 60, AllanDeviation.OctaveFactors(y.Length));

        var plot = AllanPlot.Render(
            "R7",
            AllanDeviation.Overlapping(y, 60, AllanDeviation.OctaveFactors(y.Length)),
            errorBars: true,
            new PlotSize(800, 800)
        );

        Assert.Equal(expected, plot.Data);
        Assert.Equal(9, plot.Data.Count); // m = 1 .. 256 for 1024 values (2m <= M - 1)
        PngFile.AssertImage(plot.Png, 800, 800);
    }

    [Fact]
    public void AllanPlot_ZeroDeviation_ThrowsBecauseLogAxis()
    {
        var zero = new AllanPoint(1, 1, 0, 10, 5, 0, 0);
        Assert.Throws<ArgumentException>(() => AllanPlot.Render("R1", [zero], false, PlotSize.Default));
    }
}
