using ScottPlot;

namespace SortRig.Reporting.Plots;

/// <summary>A check standard's individuals chart: values in ppm of the centre, the 3-sigma limits, points out of
/// control in red.</summary>
public static class ControlChartPlot
{
    /// <summary>Renders the chart to PNG bytes and returns the numbers it drew.</summary>
    public static RenderedPlot<ControlChartData> Render(ControlChartInput input, PlotSize size)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.ValuesOhms.Count == 0 || input.ValuesOhms.Count != input.OutOfControl.Count)
        {
            throw new ArgumentException(
                "ValuesOhms needs at least one value and one OutOfControl flag per value.",
                nameof(input)
            );
        }

        if (
            !double.IsFinite(input.SigmaOhms)
            || input.SigmaOhms <= 0
            || !double.IsFinite(input.CentreOhms)
            || input.CentreOhms <= 0
        )
        {
            throw new ArgumentException("CentreOhms and SigmaOhms must be finite and > 0.", nameof(input));
        }

        double[] ppm = input.ValuesOhms.Select(v => ((v / input.CentreOhms) - 1) * 1e6).ToArray();
        double limit = 3 * input.SigmaOhms / input.CentreOhms * 1e6;
        double[] xs = Enumerable.Range(1, ppm.Length).Select(i => (double)i).ToArray();
        Plot plot = PlotLook.Create(
            $"Check {input.CheckName}: {ppm.Length} readings",
            "Check number",
            "From the centre (ppm)"
        );
        var line = plot.Add.Scatter(xs, ppm);
        line.LegendText = "check";
        var bad = Enumerable.Range(0, ppm.Length).Where(i => input.OutOfControl[i]).ToArray();
        if (bad.Length > 0)
        {
            var marks = plot.Add.ScatterPoints(
                bad.Select(i => xs[i]).ToArray(),
                bad.Select(i => ppm[i]).ToArray(),
                Colors.Red
            );
            marks.MarkerSize = 14;
            marks.LegendText = "out of control";
        }

        var upper = plot.Add.HorizontalLine(limit, 2, Colors.Red, LinePattern.Dashed);
        upper.LegendText = "±3 sigma";
        plot.Add.HorizontalLine(-limit, 2, Colors.Red, LinePattern.Dashed);
        plot.Add.HorizontalLine(0, 1, Colors.Gray, LinePattern.Solid);
        plot.Axes.AutoScale();
        double span = Math.Max(ppm.Select(Math.Abs).Max(), limit) * 1.15;
        plot.Axes.SetLimitsY(-span, span);
        plot.ShowLegend(Alignment.UpperLeft);
        return PlotLook.Finish(plot, size, new ControlChartData(ppm, limit, -limit));
    }
}
