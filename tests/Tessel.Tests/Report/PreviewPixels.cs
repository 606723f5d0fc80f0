using SkiaSharp;
using Tessel.Output.Report;

namespace Tessel.Tests.Report;

/// <summary>Decodes preview PNGs for pixel checks.</summary>
internal static class PreviewPixels
{
    public static SKBitmap Decode(byte[] png) => SKBitmap.Decode(png) ?? throw new InvalidDataException("not a PNG");

    /// <summary>Pixels whose colour differs from the preview background.</summary>
    public static int NonBackground(byte[] png)
    {
        using var bmp = Decode(png);
        int count = 0;
        var bg = PreviewCanvas.Background;
        foreach (var c in bmp.Pixels)
            if (c.Red != bg.Red || c.Green != bg.Green || c.Blue != bg.Blue) count++;
        return count;
    }

    /// <summary>Largest per-channel difference between two colours.</summary>
    public static int Distance(SKColor a, SKColor b) =>
        Math.Max(Math.Abs(a.Red - b.Red), Math.Max(Math.Abs(a.Green - b.Green), Math.Abs(a.Blue - b.Blue)));

    /// <summary>Smallest colour distance to <paramref name="colour"/> within a (2r+1)^2 window.</summary>
    public static int NearestInWindow(SKBitmap bmp, int cx, int cy, int r, SKColor colour)
    {
        int best = int.MaxValue;
        for (int y = cy - r; y <= cy + r; y++)
            for (int x = cx - r; x <= cx + r; x++)
                if (x >= 0 && y >= 0 && x < bmp.Width && y < bmp.Height)
                    best = Math.Min(best, Distance(bmp.GetPixel(x, y), colour));
        return best;
    }
}
