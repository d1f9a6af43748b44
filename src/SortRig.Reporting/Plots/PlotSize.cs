namespace SortRig.Reporting.Plots;

/// <summary>Size of a rendered PNG in pixels.</summary>
public readonly record struct PlotSize
{
    /// <summary>Smallest accepted width or height, pixels.</summary>
    public const int Minimum = 300;

    /// <summary>Largest accepted width or height, pixels.</summary>
    public const int Maximum = 8000;

    /// <summary>Creates a size.</summary>
    /// <param name="width">Width, pixels, 300..8000.</param>
    /// <param name="height">Height, pixels, 300..8000.</param>
    public PlotSize(int width, int height)
    {
        if (width is < Minimum or > Maximum)
        {
            throw new ArgumentOutOfRangeException(
                nameof(width),
                width,
                $"Plot width must be {Minimum}..{Maximum} pixels."
            );
        }

        if (height is < Minimum or > Maximum)
        {
            throw new ArgumentOutOfRangeException(
                nameof(height),
                height,
                $"Plot height must be {Minimum}..{Maximum} pixels."
            );
        }

        Width = width;
        Height = height;
    }

    /// <summary>Default report size, 1200 x 800 pixels.</summary>
    public static PlotSize Default { get; } = new(1200, 800);

    /// <summary>Width, pixels.</summary>
    public int Width { get; }

    /// <summary>Height, pixels.</summary>
    public int Height { get; }
}

/// <summary>A rendered PNG together with the numbers that were drawn in it.</summary>
/// <typeparam name="TData">What the plot drew (bins, points).</typeparam>
/// <param name="Png">PNG file bytes.</param>
/// <param name="Size">Pixel size of the PNG.</param>
/// <param name="Data">The data behind the picture, for tables and checks.</param>
public sealed record RenderedPlot<TData>(byte[] Png, PlotSize Size, TData Data);
