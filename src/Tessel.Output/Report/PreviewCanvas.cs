using SkiaSharp;

namespace Tessel.Output.Report;

/// <summary>A CPU raster for one preview figure: fixed background, text helpers and PNG encoding.
/// Everything is drawn on the CPU in a fixed order so the same input gives the same bytes.</summary>
internal sealed class PreviewCanvas : IDisposable
{
    /// <summary>Background of every preview; tests count pixels that differ from it.</summary>
    public static readonly SKColor Background = new(250, 249, 245);
    /// <summary>Colour of axes, labels and text.</summary>
    public static readonly SKColor Ink = new(40, 40, 44);
    /// <summary>Colour of grid lines and secondary text.</summary>
    public static readonly SKColor Faint = new(214, 211, 204);

    private static readonly SKTypeface Face = PickTypeface();

    private readonly SKBitmap _bitmap;
    public SKCanvas Canvas { get; }
    public int Width { get; }
    public int Height { get; }

    public PreviewCanvas(int width, int height)
    {
        Width = width; Height = height;
        _bitmap = new SKBitmap(new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul));
        Canvas = new SKCanvas(_bitmap);
        Canvas.Clear(Background);
    }

    /// <summary>True when the typeface used for labels has glyphs on this machine.</summary>
    public static bool HasFont => Face.GlyphCount > 0;

    public static SKPaint Stroke(SKColor colour, float width, bool antialias = true) =>
        new() { Color = colour, StrokeWidth = width, IsStroke = true, IsAntialias = antialias, StrokeCap = SKStrokeCap.Butt };

    public static SKPaint Fill(SKColor colour, bool antialias = true) =>
        new() { Color = colour, IsStroke = false, IsAntialias = antialias };

    /// <summary>Draws one line of text with its baseline at y.</summary>
    public void Text(string text, float x, float y, float size, SKColor colour, SKTextAlign align = SKTextAlign.Left)
    {
        if (!HasFont)
        {
            StrokeLettering.Draw(Canvas, text, x, y, size, colour, align);
            return;
        }
        using var font = new SKFont(Face, size) { Edging = SKFontEdging.Antialias, Subpixel = false };
        using var paint = Fill(colour);
        Canvas.DrawText(text, x, y, align, font, paint);
    }

    /// <summary>Draws text turned 90 degrees counter-clockwise (for vertical axis titles), centred on (x, y).</summary>
    public void VerticalText(string text, float x, float y, float size, SKColor colour)
    {
        Canvas.Save();
        Canvas.Translate(x, y);
        Canvas.RotateDegrees(-90);
        Text(text, 0, 0, size, colour, SKTextAlign.Center);
        Canvas.Restore();
    }

    /// <summary>Advance width of a text in pixels.</summary>
    public static float MeasureText(string text, float size)
    {
        if (!HasFont) return StrokeLettering.Measure(text, size);
        using var font = new SKFont(Face, size);
        return font.MeasureText(text);
    }

    /// <summary>The pixel colour at (x, y), for tests.</summary>
    public SKColor Pixel(int x, int y) => _bitmap.GetPixel(x, y);

    /// <summary>Encodes the raster as PNG (lossless, deterministic for equal pixels).</summary>
    public byte[] ToPng()
    {
        Canvas.Flush();
        using var image = SKImage.FromBitmap(_bitmap);
        using var data = image.Encode(SKEncodedImageFormat.Png, 100);
        return data.ToArray();
    }

    public void Dispose()
    {
        Canvas.Dispose();
        _bitmap.Dispose();
    }

    private static SKTypeface PickTypeface()
    {
        // The platform default is fine when it has glyphs; otherwise ask the font manager for any face
        // that can draw Latin digits, which is all the previews need to be readable.
        var face = SKTypeface.Default;
        if (face.GlyphCount > 0) return face;
        return SKFontManager.Default.MatchCharacter('0') ?? face;
    }
}
