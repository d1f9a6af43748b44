using System.Globalization;
using ScottPlot;
using ScottPlot.Statistics;
using SortRig.Measurement.Readings;

namespace SortRig.Reporting.Plots;

/// <summary>Histogram of a reel's deviations from nominal in ppm, with tolerance limits and cup edges.</summary>
public static class ReelHistogramPlot
{
    /// <summary>Renders the histogram to PNG bytes and returns the bins it drew.</summary>
    public static RenderedPlot<ReelHistogramData> Render(ReelHistogramInput input, PlotSize size)
    {
        ArgumentNullException.ThrowIfNull(input);
        Validate(input);
        double[] ppm = input.ValuesOhms.Select(v => ((v / input.NominalOhms) - 1.0) * 1e6).ToArray();
        double width = input.BinWidthPpm ?? NiceBinWidth(ppm);
        double start = Math.Floor(ppm.Min() / width) * width;
        int bins = Math.Max(1, (int)Math.Floor((ppm.Max() - start) / width) + 1);
        var histogram = Histogram.WithBinCount(bins, start, start + (bins * width));
        histogram.AddRange(ppm);

        Plot plot = PlotLook.Create(
            $"Reel {OhmsText.Compact(input.NominalOhms)}: {ppm.Length} parts",
            string.Create(CultureInfo.InvariantCulture, $"Deviation from nominal (ppm), bins of {width:0.####} ppm"),
            "Parts per bin");
        plot.Add.Histogram(histogram);
        double[] limits = input.TolerancePercent is { } tol ? [-tol * 1e4, tol * 1e4] : [];
        foreach (double x in limits)
        {
            var line = plot.Add.VerticalLine(x, 3, Colors.Red, LinePattern.Solid);
            line.LegendText = x == limits[0] ? string.Create(CultureInfo.InvariantCulture, $"stock tolerance ±{input.TolerancePercent:G3} %") : string.Empty;
        }

        for (int i = 0; i < input.CupEdgesPpm.Count; i++)
        {
            var edge = plot.Add.VerticalLine(input.CupEdgesPpm[i], 2, Colors.DarkGreen, LinePattern.Dashed);
            edge.LegendText = i == 0 ? "cup edges" : string.Empty;
        }

        double[] xs = [histogram.Edges[0], histogram.Edges[^1], .. limits, .. input.CupEdgesPpm];
        double pad = 0.03 * (xs.Max() - xs.Min());
        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(xs.Min() - pad, xs.Max() + pad);
        plot.Axes.SetLimitsY(0, Math.Max(1, histogram.Counts.Max()) * 1.12);
        plot.ShowLegend(Alignment.UpperRight);
        var data = new ReelHistogramData(input.NominalOhms, ppm, histogram.Edges, histogram.Counts, limits, [.. input.CupEdgesPpm]);
        return PlotLook.Finish(plot, size, data);
    }

    /// <summary>1-2-5 series width giving about sqrt(n) bins, clamped to 8..50 bins.</summary>
    internal static double NiceBinWidth(double[] ppm)
    {
        double span = ppm.Max() - ppm.Min();
        if (span <= 0)
        {
            return 1.0;
        }

        double target = Math.Clamp(Math.Round(Math.Sqrt(ppm.Length)), 8, 50);
        double raw = span / target;
        double decade = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double[] steps = [1, 2, 5, 10];
        return steps.Select(s => s * decade).First(w => w >= raw * 0.999);
    }

    private static void Validate(ReelHistogramInput input)
    {
        if (!double.IsFinite(input.NominalOhms) || input.NominalOhms <= 0)
        {
            throw new ArgumentException($"NominalOhms must be finite and > 0; got {input.NominalOhms}.", nameof(input));
        }

        if (input.ValuesOhms.Count == 0 || input.ValuesOhms.Any(v => !double.IsFinite(v)))
        {
            throw new ArgumentException("ValuesOhms must hold at least one value and only finite values.", nameof(input));
        }

        if (input.BinWidthPpm is { } w && (!double.IsFinite(w) || w <= 0))
        {
            throw new ArgumentException($"BinWidthPpm must be finite and > 0 ppm; got {w}.", nameof(input));
        }
    }
}
