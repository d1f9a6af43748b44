using System.Buffers.Binary;
using SkiaSharp;

namespace SortRig.Host.Tests.Reports;

/// <summary>Independent PNG checks: signature and IHDR per the PNG specification (W3C PNG 2nd ed., sec. 5.2 and
/// 11.2.2), then a SkiaSharp decode.</summary>
internal static class PngCheck
{
    private static readonly byte[] s_signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];

    public static void AssertImage(string path, int width, int height)
    {
        var png = File.ReadAllBytes(path);
        Assert.True(png.Length > 33, $"{path} is too short for a PNG");
        Assert.Equal(s_signature, png[..8]);
        Assert.Equal("IHDR"u8.ToArray(), png[12..16]); // first chunk: length (4), type (4)
        Assert.Equal(
            (width, height),
            (
                BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(16, 4)),
                BinaryPrimitives.ReadInt32BigEndian(png.AsSpan(20, 4))
            )
        );
        using var bitmap = SKBitmap.Decode(png)
            ?? throw new InvalidOperationException($"SkiaSharp could not decode {path}");
        Assert.Equal((width, height), (bitmap.Width, bitmap.Height));
        var colours = new HashSet<SKColor>();
        for (var y = 0; y < bitmap.Height; y += 7)
        {
            for (var x = 0; x < bitmap.Width; x += 7)
            {
                colours.Add(bitmap.GetPixel(x, y));
            }
        }

        Assert.True(colours.Count > 10, $"{path} looks blank: {colours.Count} colours");
    }
}
