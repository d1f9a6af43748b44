using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Tests.Plots;

public sealed class ReelHistogramPlotTests
{
    private static readonly double[] s_values = DemoData.Parts(400, 10_000, -800, 2500, seed: 1).Select(p => p.ValueOhms).ToArray();

    [Fact]
    public void Render_GivenBinWidth_CountsEqualIndependentFloorBinning()
    {
        var input = new ReelHistogramInput(10_000, s_values, 1.0, [-2000, 0, 2000], BinWidthPpm: 500);

        RenderedPlot<ReelHistogramData> plot = ReelHistogramPlot.Render(input, new PlotSize(1000, 700));

        // Independent binning: bin k holds deviations in [500 k, 500 (k + 1)).
        double[] ppm = s_values.Select(v => ((v / 10_000) - 1) * 1e6).ToArray();
        var byBin = ppm.GroupBy(d => (int)Math.Floor(d / 500)).ToDictionary(g => g.Key, g => g.Count());
        int first = byBin.Keys.Min();
        int last = byBin.Keys.Max();
        int[] expected = Enumerable.Range(first, last - first + 1).Select(k => byBin.GetValueOrDefault(k)).ToArray();

        Assert.Equal(expected, plot.Data.Counts);
        Assert.Equal(400, plot.Data.Counts.Sum());
        Assert.Equal(first * 500.0, plot.Data.BinEdgesPpm[0], 9);
        Assert.Equal((last + 1) * 500.0, plot.Data.BinEdgesPpm[^1], 9);
        Assert.Equal(ppm, plot.Data.DeviationsPpm);
    }

    [Fact]
    public void Render_OnePercentReel_MarksToleranceAndCupEdges()
    {
        var plot = ReelHistogramPlot.Render(new ReelHistogramInput(10_000, s_values, 1.0, [-2000, 0, 2000]), PlotSize.Default);

        Assert.Equal([-10_000.0, 10_000.0], plot.Data.ToleranceLimitsPpm); // 1 % = 10 000 ppm
        Assert.Equal([-2000.0, 0, 2000], plot.Data.CupEdgesPpm);
        Assert.Equal(400, plot.Data.Counts.Sum());
        Assert.Equal(plot.Data.Counts.Length + 1, plot.Data.BinEdgesPpm.Length);
        Assert.InRange(plot.Data.Counts.Length, 8, 50);
    }

    [Fact]
    public void Render_Png_HasSignatureIhdrSizeAndDecodes()
    {
        var plot = ReelHistogramPlot.Render(new ReelHistogramInput(4990, [4990.5, 4989.7, 4991.2], null, []), new PlotSize(640, 480));

        PngFile.AssertImage(plot.Png, 640, 480);
        Assert.Equal(3, plot.Data.Counts.Sum());
        Assert.Empty(plot.Data.ToleranceLimitsPpm);
    }

    [Fact]
    public void Render_SinglePart_UsesOneBin()
    {
        var plot = ReelHistogramPlot.Render(new ReelHistogramInput(100, [100.01], 0.1, []), new PlotSize(400, 300));

        Assert.Equal([1], plot.Data.Counts);
    }

    [Fact]
    public void Render_BadNominal_ThrowsNamingField()
    {
        var ex = Assert.Throws<ArgumentException>(() => ReelHistogramPlot.Render(new ReelHistogramInput(0, [1.0], null, []), PlotSize.Default));
        Assert.Contains("NominalOhms", ex.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => new PlotSize(100, 600));
    }
}
