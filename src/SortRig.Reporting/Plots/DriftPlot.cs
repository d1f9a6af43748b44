using System.Globalization;
using ScottPlot;
using SortRig.Measurement.Drift;
using SortRig.Measurement.Readings;

namespace SortRig.Reporting.Plots;

/// <summary>Resistance deviation (ppm) against elapsed hours, temperature on a second (right) Y axis.</summary>
public static class DriftPlot
{
    /// <summary>Renders the drift plot to PNG bytes and returns the points it drew.</summary>
    public static RenderedPlot<DriftPlotData> Render(DriftPlotInput input, PlotSize size)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Samples.Count == 0)
        {
            throw new ArgumentException($"Drift channel '{input.Channel}' has no samples to plot.", nameof(input));
        }

        if (!double.IsFinite(input.ReferenceOhms) || input.ReferenceOhms <= 0)
        {
            throw new ArgumentException(
                $"ReferenceOhms must be finite and > 0; got {input.ReferenceOhms}.",
                nameof(input)
            );
        }

        DateTimeOffset origin = input.Samples.Min(s => s.Time);
        double[] hours = input.Samples.Select(s => (s.Time - origin).TotalHours).ToArray();
        double[] ppm = input.Samples.Select(s => ((s.Ohms / input.ReferenceOhms) - 1.0) * 1e6).ToArray();
        DriftSample[] withT = input.Samples.Where(s => s.TemperatureC is not null).ToArray();
        double[] tHours = withT.Select(s => (s.Time - origin).TotalHours).ToArray();
        double[] temps = withT.Select(s => s.TemperatureC!.Value).ToArray();

        string start = origin.UtcDateTime.ToString("yyyy-MM-dd HH:mm 'UTC'", CultureInfo.InvariantCulture);
        Plot plot = PlotLook.Create(
            $"Drift, channel {input.Channel} (ref. {OhmsText.Compact(input.ReferenceOhms)})",
            $"Elapsed time (h) since {start}",
            "Deviation from reference (ppm)"
        );
        var values = plot.Add.ScatterPoints(hours, ppm, Colors.Navy);
        values.MarkerSize = 5;
        values.LegendText = "resistance (ppm)";
        if (input.Fit is { } fit)
        {
            double end = hours.Max();
            var line = plot.Add.ScatterLine(
                new[] { 0.0, end },
                new[] { fit.InterceptPpm, fit.InterceptPpm + (fit.PpmPerHour.Value * end) },
                Colors.Black
            );
            line.LineWidth = 3;
            line.LegendText = string.Create(
                CultureInfo.InvariantCulture,
                $"fit {fit.PpmPerHour.Value:+0.###;-0.###} ± {fit.PpmPerHour.StandardError:0.###} ppm/h"
            );
        }

        if (temps.Length > 0)
        {
            var temperature = plot.Add.ScatterLine(tHours, temps, Colors.OrangeRed);
            temperature.LineWidth = 2;
            temperature.Axes.YAxis = plot.Axes.Right;
            temperature.LegendText = "temperature (°C)";
            plot.Axes.Right.Label.Text = "Temperature (°C)";
            plot.Axes.Right.Label.FontSize = PlotLook.LabelSize;
            plot.Axes.Right.TickLabelStyle.FontSize = PlotLook.TickSize;
        }

        plot.ShowLegend(Alignment.UpperLeft);
        return PlotLook.Finish(plot, size, new DriftPlotData(origin, hours, ppm, tHours, temps));
    }
}
