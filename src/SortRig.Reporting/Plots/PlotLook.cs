using System.Globalization;
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

    /// <summary>
    /// Limits and labelled ticks for an axis that carries log10 of the value: ticks at 1, 2, 5 x 10^k
    /// (only 1 x 10^k when the range spans more than three decades), labelled in plain numbers.
    /// </summary>
    public static void UseLogTicks(IAxis axis, double logMin, double logMax)
    {
        double lo = logMin - 0.08;
        double hi = logMax + 0.08;
        axis.Min = lo;
        axis.Max = hi;
        double[] mantissas = hi - lo > 3 ? [1] : [1, 2, 5];
        var positions = new List<double>();
        for (int k = (int)Math.Floor(lo); k <= (int)Math.Ceiling(hi); k++)
        {
            positions.AddRange(mantissas.Select(m => k + Math.Log10(m)).Where(p => p >= lo && p <= hi));
        }

        axis.SetTicks([.. positions], [.. positions.Select(p => Plain(Math.Pow(10, p)))]);
    }

    private static string Plain(double v)
    {
        double rounded = double.Parse(v.ToString("G3", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        return rounded is >= 1e-4 and < 1e7
            ? rounded.ToString("0.####", CultureInfo.InvariantCulture)
            : rounded.ToString("G3", CultureInfo.InvariantCulture);
    }
}
