using System.Globalization;
using ScottPlot;

namespace SortRig.Reporting.Plots;

/// <summary>Sets made against parts bought: median line, 5–95 % band, the sets wanted and the order at each
/// confidence.</summary>
public static class OrderCurvePlot
{
    /// <summary>Renders the plot to PNG bytes and returns its input.</summary>
    /// <param name="input">At least two points, equal lengths, parts rising, low ≤ median ≤ high.</param>
    /// <param name="size">PNG size.</param>
    public static RenderedPlot<OrderCurveInput> Render(OrderCurveInput input, PlotSize size)
    {
        ArgumentNullException.ThrowIfNull(input);
        var n = input.PartsBought.Count;
        if (
            n < 2
            || input.Median.Count != n
            || input.Low.Count != n
            || input.High.Count != n
            || input.PartsBought.Zip(input.PartsBought.Skip(1)).Any(p => !(p.Second > p.First))
            || Enumerable.Range(0, n).Any(i => !(input.Low[i] <= input.Median[i] && input.Median[i] <= input.High[i]))
        )
        {
            throw new ArgumentException(
                "the order plot needs at least two points with rising parts and low <= median <= high",
                nameof(input)
            );
        }

        double[] xs = [.. input.PartsBought];
        Plot plot = PlotLook.Create(
            $"Order for {input.SetsWanted} sets of {input.RecipeName}",
            "Parts bought",
            "Sets made"
        );
        var band = plot.Add.FillY(xs, [.. input.Low], [.. input.High]);
        band.FillColor = Colors.SteelBlue.WithAlpha(0.3);
        band.LineColor = Colors.SteelBlue.WithAlpha(0.3);
        band.LegendText = "5 % to 95 % of trials";
        var median = plot.Add.Scatter(xs, [.. input.Median], Colors.Navy);
        median.LineWidth = 3;
        median.MarkerSize = 8;
        median.LegendText = "median";
        var wanted = plot.Add.HorizontalLine(input.SetsWanted, 2, Colors.DarkGreen, LinePattern.Dashed);
        wanted.LegendText = string.Create(CultureInfo.InvariantCulture, $"{input.SetsWanted} sets wanted");
        foreach (var (label, parts) in input.Orders)
        {
            var line = plot.Add.VerticalLine(parts, 2, Colors.DarkRed, LinePattern.Dotted);
            line.Text = label;
            line.LabelFontSize = PlotLook.LegendSize;
        }

        plot.Axes.AutoScale();
        plot.Axes.SetLimitsY(0, Math.Max(input.SetsWanted, input.High.Max()) * 1.1);
        plot.ShowLegend(Alignment.UpperLeft);
        return PlotLook.Finish(plot, size, input);
    }
}
