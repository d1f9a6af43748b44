using ScottPlot;

namespace SortRig.Reporting.Plots;

/// <summary>Shared look of report plots: one sans font, large text for print and projector.</summary>
internal static class PlotLook
{
    public const float TitleSize = 30;
    public const float LabelSize = 24;
    public const float TickSize = 19;
    public const float LegendSize = 18;

    public static Plot Create(string title, string xLabel, string yLabel)
    {
        var plot = new Plot();
        plot.Font.Set("DejaVu Sans", FontWeight.Normal, FontSlant.Upright, FontSpacing.Normal);
        plot.Title(title, TitleSize);
        plot.XLabel(xLabel, LabelSize);
        plot.YLabel(yLabel, LabelSize);
        plot.Axes.Bottom.TickLabelStyle.FontSize = TickSize;
        plot.Axes.Left.TickLabelStyle.FontSize = TickSize;
        plot.Legend.FontSize = LegendSize;
        return plot;
    }

    public static RenderedPlot<TData> Finish<TData>(Plot plot, PlotSize size, TData data)
    {
        byte[] png = plot.GetImageBytes(size.Width, size.Height, ImageFormat.Png);
        plot.Dispose();
        return new RenderedPlot<TData>(png, size, data);
    }

    /// <summary>Tick labels for an axis that carries log10 of the value.</summary>
    public static void UseLogTicks(IAxis axis)
    {
        axis.TickGenerator = new ScottPlot.TickGenerators.NumericAutomatic
        {
            IntegerTicksOnly = true,
            MinorTickGenerator = new ScottPlot.TickGenerators.LogMinorTickGenerator(),
            LabelFormatter = v => Math.Pow(10, v).ToString("G3", System.Globalization.CultureInfo.InvariantCulture),
        };
    }
}
