using SkiaSharp;

namespace BcPrep.Tests.Report;

/// <summary>A decoded PNG for assertions: size, how many distinct colours, how many dark pixels in a region.</summary>
internal sealed class PngImage
{
    private static readonly byte[] Signature = [0x89, (byte)'P', (byte)'N', (byte)'G', 0x0D, 0x0A, 0x1A, 0x0A];

    private readonly SKColor[] _pixels;

    private PngImage(int width, int height, SKColor[] pixels)
    {
        Width = width;
        Height = height;
        _pixels = pixels;
    }

    public int Width { get; }

    public int Height { get; }

    /// <summary>Decodes <paramref name="png"/>; fails the test when the bytes are not a PNG (signature per the PNG specification, ISO/IEC 15948 5.2).</summary>
    public static PngImage Decode(byte[] png)
    {
        Assert.True(png.Length > Signature.Length && png.AsSpan(0, Signature.Length).SequenceEqual(Signature), "not a PNG signature");
        using var bitmap = SKBitmap.Decode(png);
        Assert.NotNull(bitmap);
        return new PngImage(bitmap.Width, bitmap.Height, bitmap.Pixels);
    }

    public int DistinctColours => _pixels.Distinct().Count();

    /// <summary>Pixels darker than mid grey (luma below 128) in the rectangle [x0, x1) × [y0, y1).</summary>
    public int DarkPixels(int x0, int y0, int x1, int y1)
    {
        var count = 0;
        for (var y = Math.Max(0, y0); y < Math.Min(Height, y1); y++)
        {
            for (var x = Math.Max(0, x0); x < Math.Min(Width, x1); x++)
            {
                var c = _pixels[(y * Width) + x];
                if ((0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue) < 128)
                {
                    count++;
                }
            }
        }
        return count;
    }

    /// <summary>Luma (ITU-R BT.601 weights) of the pixel at column <paramref name="x"/>, row <paramref name="y"/>: 0 black, 255 white.</summary>
    public double Luma(int x, int y)
    {
        var c = _pixels[(y * Width) + x];
        return (0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue);
    }

    /// <summary>Pixels that differ between two images of the same size.</summary>
    public int DifferingPixels(PngImage other)
    {
        Assert.Equal((Width, Height), (other.Width, other.Height));
        return _pixels.Zip(other._pixels).Count(p => p.First != p.Second);
    }
}
