using System.Buffers.Binary;
using SkiaSharp;

namespace SortRig.Reporting.Tests;

/// <summary>Independent PNG checks: signature and IHDR per the PNG specification (W3C PNG 2nd ed., sec. 5.2 and
/// 11.2.2).</summary>
internal static class PngFile
{
    private static readonly byte[] s_signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    public static (int Width, int Height) Header(byte[] png)
    {
        Assert.True(png.Length > 33, "PNG too short");
        Assert.Equal(s_signature, png[..8]);
        Assert.Equal("IHDR"u8.ToArray(), png[12..16]); // first chunk: length (4), type (4)
        return (
            BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16, 4)),
            BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20, 4))
        );
    }

    /// <summary>Decodes with SkiaSharp and returns the size and the number of distinct colours in a coarse
    /// grid.</summary>
    public static (int Width, int Height, int Colours) Decode(byte[] png)
    {
        using SKBitmap bitmap = SKBitmap.Decode(png)
            ?? throw new InvalidOperationException("SkiaSharp could not decode the PNG");
        var colours = new HashSet<SKColor>();
        for (int y = 0; y < bitmap.Height; y += 7)
        {
            for (int x = 0; x < bitmap.Width; x += 7)
            {
                colours.Add(bitmap.GetPixel(x, y));
            }
        }

        return (bitmap.Width, bitmap.Height, colours.Count);
    }

    public static void AssertImage(byte[] png, int width, int height)
    {
        Assert.Equal((width, height), Header(png));
        (int w, int h, int colours) = Decode(png);
        Assert.Equal((width, height), (w, h));
        Assert.True(colours > 10, $"image looks blank: {colours} colours");
    }
}
