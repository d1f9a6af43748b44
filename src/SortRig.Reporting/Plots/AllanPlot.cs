using ScottPlot;
using SortRig.Measurement.Drift;

namespace SortRig.Reporting.Plots;

/// <summary>Log-log overlapping Allan deviation (ppm) against averaging time, optional 68 % error bars.</summary>
public static class AllanPlot
{
    /// <summary>Renders the ADEV plot to PNG bytes and returns the points it drew (as given).</summary>
    /// <param name="channel">Channel name shown in the title.</param>
    /// <param name="points">Points from <see cref="AllanDeviation.Overlapping"/>; at least one, all deviations &gt;
    /// 0.</param>
    /// <param name="errorBars">Draw the chi-square interval of each point.</param>
    /// <param name="size">PNG size.</param>
    public static RenderedPlot<IReadOnlyList<AllanPoint>> Render(
        string channel,
        IReadOnlyList<AllanPoint> points,
        bool errorBars,
        PlotSize size
    )
    {
        ArgumentNullException.ThrowIfNull(points);
        if (points.Count == 0 || points.Any(p => !(p.Deviation > 0) || !(p.TauSeconds > 0)))
        {
            throw new ArgumentException(
                $"Channel '{channel}': need at least one ADEV point, each with tau > 0 and deviation > 0 for a "
                    + $"log-log plot.",
                nameof(points)
            );
        }

        double[] logTau = points.Select(p => Math.Log10(p.TauSeconds)).ToArray();
        double[] logPpm = points.Select(p => Math.Log10(p.Deviation * 1e6)).ToArray();
        Plot plot = PlotLook.Create(
            $"Overlapping Allan deviation, channel {channel}",
            "Averaging time τ (s)",
            "Allan deviation σ(τ) (ppm)"
        );
        var line = plot.Add.Scatter(logTau, logPpm, Colors.Navy);
        line.LineWidth = 2;
        line.MarkerSize = 9;
        line.LegendText = "σ(τ), fractional, in ppm";
        if (errorBars)
        {
            double[] zeros = new double[points.Count];
            double[] up = points.Select((p, i) => Math.Log10(p.Upper * 1e6) - logPpm[i]).ToArray();
            double[] down = points
                .Select((p, i) => logPpm[i] - Math.Log10(Math.Max(p.Lower, p.Deviation * 1e-3) * 1e6))
                .ToArray();
            var bars = plot.Add.ErrorBar(logTau, logPpm, zeros);
            bars.YErrorPositive = up;
            bars.YErrorNegative = down;
            bars.LineWidth = 2;
            bars.LineColor = Colors.Navy;
        }

        PlotLook.UseLogTicks(plot.Axes.Bottom, logTau.Min(), logTau.Max());
        double[] yLow = errorBars
            ? points.Select(p => Math.Log10(Math.Max(p.Lower, p.Deviation * 1e-3) * 1e6)).ToArray()
            : logPpm;
        double[] yHigh = errorBars ? points.Select(p => Math.Log10(p.Upper * 1e6)).ToArray() : logPpm;
        PlotLook.UseLogTicks(plot.Axes.Left, yLow.Min(), yHigh.Max());
        plot.ShowLegend(Alignment.UpperRight);
        return PlotLook.Finish(plot, size, points);
    }
}
