using System.Globalization;
using System.Text;
using SkiaSharp;

namespace Tessel.Output.IO;

/// <summary>Small invented example inputs that 'tessel scaffold' writes beside a height-map or mesh job,
/// so that the scaffold builds as written. Both describe the same gentle shallow dome, 20 x 15 m in plan
/// with 1.2 m of rise; they are deterministic.</summary>
public static class ScaffoldInputs
{
    /// <summary>File name of the height map the height-map scaffold names.</summary>
    public const string HeightMapFile = "site-heights.png";

    /// <summary>File name of the mesh the mesh scaffold names.</summary>
    public const string MeshFile = "canopy.obj";

    /// <summary>Example input for a target kind: (file name, bytes), or null when the kind needs none.</summary>
    public static (string Name, byte[] Bytes)? For(string kind) => kind switch
    {
        "height-map" => (HeightMapFile, HeightMapPng()),
        "mesh" => (MeshFile, MeshObj()),
        _ => null,
    };

    /// <summary>Height of the example dome over [-1, 1]^2 (relative plan coordinates), 0..1.</summary>
    private static double Dome(double u, double v) => Math.Clamp(1 - 0.5 * (u * u + v * v), 0, 1);

    /// <summary>A 64 x 48 pixel 8-bit grayscale PNG: white at the centre, grey at the corners.</summary>
    public static byte[] HeightMapPng()
    {
        const int w = 64, h = 48;
        var info = new SKImageInfo(w, h, SKColorType.Gray8, SKAlphaType.Opaque);
        using var bitmap = new SKBitmap(info);
        for (int y = 0; y < h; y++)
            for (int x = 0; x < w; x++)
            {
                double u = 2 * (x + 0.5) / w - 1, v = 2 * (y + 0.5) / h - 1;
                byte level = (byte)Math.Round(255 * Dome(u, v));
                bitmap.SetPixel(x, y, new SKColor(level, level, level));
            }
        using var data = bitmap.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    /// <summary>An OBJ grid of 13 x 11 vertices over 20 x 15 m, z = 1.8 + 1.2 * dome, two triangles per square.</summary>
    public static byte[] MeshObj()
    {
        const int nx = 13, ny = 11;
        var sb = new StringBuilder("# Example surface written by 'tessel scaffold': a shallow dome, 20 x 15 m, metres.\n");
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                double u = 2.0 * i / (nx - 1) - 1, v = 2.0 * j / (ny - 1) - 1;
                sb.Append(string.Create(CultureInfo.InvariantCulture, $"v {10 * u:0.###} {7.5 * v:0.###} {1.8 + 1.2 * Dome(u, v):0.####}\n"));
            }
        for (int j = 0; j + 1 < ny; j++)
            for (int i = 0; i + 1 < nx; i++)
            {
                int a = j * nx + i + 1, b = a + 1, c = a + nx + 1, d = a + nx;
                sb.Append(CultureInfo.InvariantCulture, $"f {a} {b} {c}\nf {a} {c} {d}\n");
            }
        return Encoding.ASCII.GetBytes(sb.ToString());
    }
}
