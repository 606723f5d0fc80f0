using System.Globalization;
using System.Runtime.InteropServices;
using SkiaSharp;
using Tessel.Core.Geometry;
using Tessel.Core.Pipeline;
using Tessel.Core.Targets;

namespace Tessel.Output.Previews;

/// <summary>Renders a target as a plan view: height as colour with soft hill shading and contour
/// lines, the footprint outline, a scale bar and a colour bar. x runs to the right, y up.</summary>
public static class TargetPreview
{
    private const int MapSize = 760;      // longer side of the map, pixels
    private const int Pad = 28;
    private const int TitleH = 54;
    private const int BottomH = 70;
    private const int BarW = 150;         // room right of the map for the colour bar and its labels

    /// <summary>PNG bytes of the preview.</summary>
    /// <param name="target">The target in metres.</param>
    /// <param name="figures">Its measured figures (height range for the colours).</param>
    /// <param name="title">First line of the heading (normally the job name).</param>
    public static byte[] Render(ITargetSurface target, TargetFigures figures, string title)
    {
        var f = target.Footprint;
        double ppm = MapSize / Math.Max(f.Width, f.Depth); // pixels per metre
        int mapW = Math.Max(1, (int)Math.Round(f.Width * ppm)), mapH = Math.Max(1, (int)Math.Round(f.Depth * ppm));
        int width = Pad + mapW + BarW, height = TitleH + mapH + BottomH;
        var info = new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul);
        using var bitmap = new SKBitmap(info);
        var pixels = new int[width * height];
        Array.Fill(pixels, Pack(Paper));
        DrawMap(pixels, width, target, figures, ppm, mapW, mapH);
        Marshal.Copy(pixels, 0, bitmap.GetPixels(), pixels.Length);
        using (var canvas = new SKCanvas(bitmap))
        {
            DrawOutline(canvas, f, ppm, mapH);
            using var typeface = SKTypeface.FromFamilyName("DejaVu Sans") ?? SKTypeface.Default;
            using var font = new SKFont(typeface, 15);
            using var small = new SKFont(typeface, 12);
            using var ink = new SKPaint { Color = new SKColor(0x22, 0x22, 0x22), IsAntialias = true };
            canvas.DrawText(title, Pad, 24, SKTextAlign.Left, font, ink);
            canvas.DrawText(target.Description + "  (plan view, x right, y up)", Pad, 44, SKTextAlign.Left, small, ink);
            DrawScaleBar(canvas, f, ppm, mapH, ContourInterval(figures), small, ink);
            DrawColourBar(canvas, figures, mapW, mapH, small, ink);
        }
        using var data = bitmap.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    private static double MapX(Footprint f, double ppm, double x) => Pad + (x - f.MinX) * ppm;
    private static double MapY(Footprint f, double ppm, int mapH, double y) => TitleH + mapH - (y - f.MinY) * ppm;

    private static readonly SKColor Paper = new(0xfa, 0xf8, 0xf3);

    /// <summary>Colours the map area of the RGBA pixel buffer (width <paramref name="stride"/>) directly.</summary>
    private static void DrawMap(int[] pixels, int stride, ITargetSurface target, TargetFigures fig, double ppm, int mapW, int mapH)
    {
        var f = target.Footprint;
        double lo = fig.MinHeight, hi = fig.MaxHeight, range = hi - lo;
        // About ten contour bands over the height range, at a round interval.
        double interval = ContourInterval(fig) ?? double.PositiveInfinity;
        var z = new double[mapW * mapH];
        var shade = new double[mapW * mapH];
        var light = new Vec3(-0.4, 0.5, 0.77).Normalized();
        for (int j = 0; j < mapH; j++)
        {
            double y = f.MaxY - (j + 0.5) / ppm;
            for (int i = 0; i < mapW; i++)
            {
                double x = f.MinX + (i + 0.5) / ppm;
                int k = j * mapW + i;
                z[k] = f.Contains(x, y) ? target.HeightAt(x, y) : double.NaN;
                if (double.IsFinite(z[k])) shade[k] = Math.Max(0, Vec3.Dot(target.NormalAt(x, y), light));
            }
        }
        for (int j = 0; j < mapH; j++)
            for (int i = 0; i < mapW; i++)
            {
                int k = j * mapW + i;
                if (!double.IsFinite(z[k])) continue;
                var c = HeightPalette.At(range > 0 ? (z[k] - lo) / range : 0.5);
                double s = 0.72 + 0.28 * shade[k];
                bool contour = false;
                if (double.IsFinite(interval))
                {
                    long band = (long)Math.Floor(z[k] / interval);
                    if (i + 1 < mapW && double.IsFinite(z[k + 1]) && (long)Math.Floor(z[k + 1] / interval) != band) contour = true;
                    if (j + 1 < mapH && double.IsFinite(z[k + mapW]) && (long)Math.Floor(z[k + mapW] / interval) != band) contour = true;
                }
                if (contour) s *= 0.6;
                pixels[(TitleH + j) * stride + Pad + i] = Pack(new SKColor((byte)(c.Red * s), (byte)(c.Green * s), (byte)(c.Blue * s)));
            }
    }

    /// <summary>One opaque RGBA8888 pixel as the little-endian int Skia stores.</summary>
    private static int Pack(SKColor c) => c.Red | (c.Green << 8) | (c.Blue << 16) | unchecked((int)0xff000000);

    private static void DrawOutline(SKCanvas canvas, Footprint f, double ppm, int mapH)
    {
        using var pen = new SKPaint { Color = new SKColor(0x22, 0x22, 0x22), Style = SKPaintStyle.Stroke, StrokeWidth = 1.5f, IsAntialias = true, StrokeCap = SKStrokeCap.Round };
        for (int i = 0; i < f.Corners.Length; i++)
        {
            var a = f.Corners[i]; var b = f.Corners[(i + 1) % f.Corners.Length];
            canvas.DrawLine((float)MapX(f, ppm, a.X), (float)MapY(f, ppm, mapH, a.Y), (float)MapX(f, ppm, b.X), (float)MapY(f, ppm, mapH, b.Y), pen);
        }
    }

    private static void DrawScaleBar(SKCanvas canvas, Footprint f, double ppm, int mapH, double? contourInterval, SKFont font, SKPaint ink)
    {
        double metres = NiceStep(f.Width / 4);
        float x0 = Pad, y0 = TitleH + mapH + 22, seg = (float)(metres * ppm / 4);
        using var fill = new SKPaint { Color = new SKColor(0x22, 0x22, 0x22), Style = SKPaintStyle.Fill };
        using var frame = new SKPaint { Color = new SKColor(0x22, 0x22, 0x22), Style = SKPaintStyle.Stroke, StrokeWidth = 1 };
        for (int i = 0; i < 4; i++)
        {
            var r = new SKRect(x0 + i * seg, y0, x0 + (i + 1) * seg, y0 + 8);
            if (i % 2 == 0) canvas.DrawRect(r, fill);
            canvas.DrawRect(r, frame);
        }
        canvas.DrawText("0", x0, y0 + 24, SKTextAlign.Center, font, ink);
        canvas.DrawText(Length(metres), x0 + 4 * seg, y0 + 24, SKTextAlign.Center, font, ink);
        canvas.DrawText($"footprint {Length(f.Width)} x {Length(f.Depth)}", x0 + 4 * seg + 40, y0 + 9, SKTextAlign.Left, font, ink);
        if (contourInterval is double ci && double.IsFinite(ci))
            canvas.DrawText($"contours every {Length(ci)}", x0 + 4 * seg + 40, y0 + 25, SKTextAlign.Left, font, ink);
    }

    private static void DrawColourBar(SKCanvas canvas, TargetFigures fig, int mapW, int mapH, SKFont font, SKPaint ink)
    {
        float x0 = Pad + mapW + 24, top = TitleH + 16, h = Math.Min(mapH - 20, 320), w = 18;
        for (int i = 0; i < (int)h; i++)
        {
            using var p = new SKPaint { Color = HeightPalette.At(1 - i / (h - 1)), Style = SKPaintStyle.Fill };
            canvas.DrawRect(new SKRect(x0, top + i, x0 + w, top + i + 1), p);
        }
        using var frame = new SKPaint { Color = new SKColor(0x22, 0x22, 0x22), Style = SKPaintStyle.Stroke, StrokeWidth = 1 };
        canvas.DrawRect(new SKRect(x0, top, x0 + w, top + h), frame);
        canvas.DrawText("height", x0, top - 6, SKTextAlign.Left, font, ink);
        canvas.DrawText(Height(fig.MaxHeight), x0 + w + 6, top + 10, SKTextAlign.Left, font, ink);
        canvas.DrawText(Height(0.5 * (fig.MinHeight + fig.MaxHeight)), x0 + w + 6, top + h / 2 + 4, SKTextAlign.Left, font, ink);
        canvas.DrawText(Height(fig.MinHeight), x0 + w + 6, top + h, SKTextAlign.Left, font, ink);
        canvas.DrawText("K from", x0, top + h + 30, SKTextAlign.Left, font, ink);
        canvas.DrawText($"{Sci(fig.MinGaussianCurvature)} to", x0, top + h + 46, SKTextAlign.Left, font, ink);
        canvas.DrawText($"{Sci(fig.MaxGaussianCurvature)} 1/m²", x0, top + h + 62, SKTextAlign.Left, font, ink);
    }

    /// <summary>Height between contour lines: a round step giving about ten bands; null for a flat target.</summary>
    private static double? ContourInterval(TargetFigures fig)
    {
        double range = fig.MaxHeight - fig.MinHeight;
        return range > 1e-9 * Math.Max(1, Math.Abs(fig.MaxHeight)) ? NiceStep(range / 10) : null;
    }

    /// <summary>1, 2 or 5 times a power of ten, the largest not above <paramref name="x"/>.</summary>
    internal static double NiceStep(double x)
    {
        if (!(x > 0) || !double.IsFinite(x)) return 1;
        double p = Math.Pow(10, Math.Floor(Math.Log10(x)));
        double m = x / p;
        return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
    }

    private static string Length(double metres) =>
        Math.Abs(metres) >= 1 || metres == 0
            ? metres.ToString("0.###", CultureInfo.InvariantCulture) + " m"
            : (metres * 1000).ToString("0.#", CultureInfo.InvariantCulture) + " mm";

    /// <summary>Heights always in metres so the colour bar reads as one scale.</summary>
    private static string Height(double metres) => metres.ToString("0.###", CultureInfo.InvariantCulture) + " m";

    private static string Sci(double v) => Math.Abs(v) < 1e-12 ? "0" : v.ToString("0.####", CultureInfo.InvariantCulture);
}
