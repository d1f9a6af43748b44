using SortRig.Reporting.Plots;

namespace SortRig.Reporting.Tests.Plots;

public sealed class ReelHistogramPlotTests
{
    private static readonly double[] s_values = DemoData
        .Parts(400, 10_000, -800, 2500, seed: 1)
        .Select(p => p.ValueOhms)
        .ToArray();

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
        var plot = ReelHistogramPlot.Render(
            new ReelHistogramInput(10_000, s_values, 1.0, [-2000, 0, 2000]),
            PlotSize.Default
        );

        Assert.Equal([-10_000.0, 10_000.0], plot.Data.ToleranceLimitsPpm); // 1 % = 10 000 ppm
        Assert.Equal([-2000.0, 0, 2000], plot.Data.CupEdgesPpm);
        Assert.Equal(400, plot.Data.Counts.Sum());
        Assert.Equal(plot.Data.Counts.Length + 1, plot.Data.BinEdgesPpm.Length);
        // Evenly spaced cups: one bar per cup width, on the cup edges.
        Assert.All(plot.Data.BinEdgesPpm, e => Assert.Equal(0, Math.IEEERemainder(e, 2000), 6));
        Assert.Equal(2000, plot.Data.BinEdgesPpm[1] - plot.Data.BinEdgesPpm[0], 6);
    }

    [Fact]
    public void Render_CupsEvery1000Ppm_OneBarPerCup_CountsAsAnIndependentFloorBinning()
    {
        // 40 parts from -9 750 to +9 750 ppm in 500 ppm steps, cups every 1 000 ppm from -10 000 to +10 000.
        double[] ppm = [.. Enumerable.Range(0, 40).Select(i => -9_750.0 + (500 * i))];
        double[] edges = [.. Enumerable.Range(0, 21).Select(i => -10_000.0 + (1000 * i))];
        var input = new ReelHistogramInput(10_000, [.. ppm.Select(d => 10_000 * (1 + (d * 1e-6)))], 1.0, edges);

        var plot = ReelHistogramPlot.Render(input, PlotSize.Default);

        // Hand count: each 1 000 ppm cup holds exactly two of the parts (was: 5 000 ppm bars, 4 of them).
        Assert.Equal(Enumerable.Repeat(2, 20), plot.Data.Counts);
        Assert.Equal(-10_000, plot.Data.BinEdgesPpm[0], 6);
        Assert.Equal(10_000, plot.Data.BinEdgesPpm[^1], 6);
    }

    [Fact]
    public void NiceBinWidth_NearestOfTheOneTwoFiveSeries_NotTheNextUp()
    {
        // 20 parts over 19 000 ppm: target 8 bins (sqrt 20 clamped to 8), raw width 2 375 ppm; 2 000 is a factor
        // 1.19 away, 5 000 a factor 2.1 (arithmetic), so 2 000.
        double[] ppm = [.. Enumerable.Range(0, 20).Select(i => -9_500.0 + (1000 * i))];

        Assert.Equal(2000, ReelHistogramPlot.NiceBinWidth(ppm), 9);
    }

    [Fact]
    public void Render_Png_HasSignatureIhdrSizeAndDecodes()
    {
        var plot = ReelHistogramPlot.Render(
            new ReelHistogramInput(4990, [4990.5, 4989.7, 4991.2], null, []),
            new PlotSize(640, 480)
        );

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
        var ex = Assert.Throws<ArgumentException>(() =>
            ReelHistogramPlot.Render(new ReelHistogramInput(0, [1.0], null, []), PlotSize.Default)
        );
        Assert.Contains("NominalOhms", ex.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => new PlotSize(100, 600));
    }
}
