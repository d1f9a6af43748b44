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
        double width = input.BinWidthPpm ?? CupBinWidth(input.CupEdgesPpm) ?? NiceBinWidth(ppm);
        double origin =
            input.BinWidthPpm is null && CupBinWidth(input.CupEdgesPpm) is not null ? input.CupEdgesPpm.Min() : 0;
        double start = origin + (Math.Floor((ppm.Min() - origin) / width) * width);
        int bins = Math.Max(1, (int)Math.Floor((ppm.Max() - start) / width) + 1);
        var histogram = Histogram.WithBinCount(bins, start, start + (bins * width));
        histogram.AddRange(ppm);

        Plot plot = PlotLook.Create(
            $"Reel {OhmsText.Compact(input.NominalOhms)}: {ppm.Length} parts",
            string.Create(CultureInfo.InvariantCulture, $"Deviation from nominal (ppm), bins of {width:0.####} ppm"),
            "Parts per bin"
        );
        plot.Add.Histogram(histogram);
        double[] limits = input.TolerancePercent is { } tol ? [-tol * 1e4, tol * 1e4] : [];
        foreach (double x in limits)
        {
            var line = plot.Add.VerticalLine(x, 3, Colors.Red, LinePattern.Solid);
            line.LegendText =
                x == limits[0]
                    ? string.Create(CultureInfo.InvariantCulture, $"stock tolerance ±{input.TolerancePercent:G3} %")
                    : string.Empty;
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
        var data = new ReelHistogramData(
            input.NominalOhms,
            ppm,
            histogram.Edges,
            histogram.Counts,
            limits,
            [.. input.CupEdgesPpm]
        );
        return PlotLook.Finish(plot, size, data);
    }

    /// <summary>
    /// Evenly spaced cup edges: one bar per cup width, lined up with the edges, so each bar is what a cup holds.
    /// Null without at least two edges or when they are not evenly spaced (adaptive cups).
    /// </summary>
    internal static double? CupBinWidth(IReadOnlyList<double> edges)
    {
        if (edges.Count < 2)
        {
            return null;
        }

        double[] sorted = [.. edges.Order()];
        double[] gaps = [.. sorted.Zip(sorted.Skip(1), (a, b) => b - a)];
        double spacing = gaps.Average();
        return spacing > 0 && gaps.All(g => Math.Abs(g - spacing) <= 1e-6 * spacing) ? spacing : null;
    }

    /// <summary>
    /// The 1-2-5 series width nearest (in ratio) to the one giving about sqrt(n) bins, clamped to 8..50 bins
    /// (common practice, no source): never more than a factor 1.6 from the target count.
    /// </summary>
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
        return steps.Select(s => s * decade).MinBy(w => Math.Abs(Math.Log(w / raw)));
    }

    private static void Validate(ReelHistogramInput input)
    {
        if (!double.IsFinite(input.NominalOhms) || input.NominalOhms <= 0)
        {
            throw new ArgumentException($"NominalOhms must be finite and > 0; got {input.NominalOhms}.", nameof(input));
        }

        if (input.ValuesOhms.Count == 0 || input.ValuesOhms.Any(v => !double.IsFinite(v)))
        {
            throw new ArgumentException(
                "ValuesOhms must hold at least one value and only finite values.",
                nameof(input)
            );
        }

        if (input.BinWidthPpm is { } w && (!double.IsFinite(w) || w <= 0))
        {
            throw new ArgumentException($"BinWidthPpm must be finite and > 0 ppm; got {w}.", nameof(input));
        }
    }
}
