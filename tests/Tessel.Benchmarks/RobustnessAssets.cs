using SkiaSharp;

namespace Tessel.Benchmarks;

/// <summary>Input files of the robustness corpus, made here (invented shapes, no outside data).</summary>
public static class RobustnessAssets
{
    public static void Write(string folder)
    {
        File.WriteAllBytes(Path.Combine(folder, "terrain.png"), Terrain(96, 64));
        File.WriteAllText(Path.Combine(folder, "ring-sector.obj"), Tessel.Tests.Targets.RingSectorMesh.Obj());
    }

    /// <summary>A gray PNG of two soft hills and a shallow hollow (white = high).</summary>
    private static byte[] Terrain(int width, int height)
    {
        using var bitmap = new SKBitmap(new SKImageInfo(width, height, SKColorType.Gray8, SKAlphaType.Opaque));
        for (int j = 0; j < height; j++)
            for (int i = 0; i < width; i++)
            {
                double x = (i + 0.5) / width * 6 - 3, y = (j + 0.5) / height * 4 - 2;
                double z = 0.55 * Math.Exp(-((x + 1.1) * (x + 1.1) + y * y) / 2.2)
                         + 0.35 * Math.Exp(-((x - 1.4) * (x - 1.4) + (y - 0.5) * (y - 0.5)) / 1.4)
                         - 0.15 * Math.Exp(-((x - 0.6) * (x - 0.6) + (y + 1.2) * (y + 1.2)) / 0.8) + 0.2;
                byte g = (byte)Math.Clamp(Math.Round(z / 0.8 * 255), 0, 255);
                bitmap.SetPixel(i, j, new SKColor(g, g, g));
            }
        using var image = SKImage.FromBitmap(bitmap);
        return image.Encode(SKEncodedImageFormat.Png, 100).ToArray();
    }
}
