using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Writes one sheet as a PNG raster at <see cref="Dpi"/> dots per inch on a white
/// background, with a pHYs chunk giving the physical resolution so it prints at true size.</summary>
/// <remarks>
/// The image is round(size mm / 25.4 x dpi) pixels each way. PNG (ISO/IEC 15948) records physical
/// resolution in a pHYs chunk in pixels per metre (unit byte 1), here round(dpi / 0.0254), e.g.
/// 11811 for 300 dpi. SkiaSharp's encoder writes no pHYs, so the chunk (with its CRC-32) is inserted
/// straight after IHDR, where the standard allows it (before IDAT). Lines are never drawn thinner
/// than one pixel, so hairlines stay visible.
/// </remarks>
public sealed class PngSheetWriter : ISheetWriter
{
    /// <summary>Resolution used when none is given.</summary>
    public const int DefaultDpi = 300;

    /// <summary>Largest accepted pixel count per side, to fail clearly rather than exhaust memory.</summary>
    public const int MaxPixelsPerSide = 30_000;

    /// <summary>Creates a writer for <paramref name="dpi"/> dots per inch (10..2400).</summary>
    public PngSheetWriter(int dpi = DefaultDpi)
    {
        if (dpi is < 10 or > 2400) throw new ArgumentOutOfRangeException(nameof(dpi), dpi, "Resolution must be 10..2400 dpi.");
        Dpi = dpi;
    }

    /// <summary>Dots per inch of the raster.</summary>
    public int Dpi { get; }

    /// <summary>Pixels per metre written into pHYs: round(dpi / 0.0254).</summary>
    public uint PixelsPerMetre => (uint)Math.Round(Dpi / 0.0254, MidpointRounding.AwayFromZero);

    /// <summary>PNG sheets for printing and previews; the dpi comes from the build (large sheets get less).</summary>
    public static SheetFormat Format { get; } = new("png", ".png", "png", o => o.Png,
        CarriesCover: true, OneFilePerSheet: true, ForPrinting: true, o => new PngSheetWriter(o.PngDpi));

    /// <inheritdoc/>
    public string FileExtension => Format.FileExtension;

    /// <inheritdoc/>
    public bool OneFilePerSheet => Format.OneFilePerSheet;

    /// <summary>Pixel size of <paramref name="sheet"/> at this resolution.</summary>
    public (int Width, int Height) PixelSize(Sheet sheet) =>
        ((int)Math.Round(sheet.WidthMm / 25.4 * Dpi, MidpointRounding.AwayFromZero),
         (int)Math.Round(sheet.HeightMm / 25.4 * Dpi, MidpointRounding.AwayFromZero));

    /// <inheritdoc/>
    public void Write(IReadOnlyList<Sheet> sheets, LineStyleTable styles, Stream output) =>
        Write(SheetWriterGuard.Single(sheets, "PNG"), styles, output);

    /// <summary>Renders <paramref name="sheet"/> and writes it to <paramref name="output"/> as PNG.</summary>
    public void Write(Sheet sheet, LineStyleTable styles, Stream output)
    {
        SheetWriterGuard.Check(sheet);
        ArgumentNullException.ThrowIfNull(styles);
        ArgumentNullException.ThrowIfNull(output);
        var (width, height) = PixelSize(sheet);
        if (width < 1 || height < 1 || width > MaxPixelsPerSide || height > MaxPixelsPerSide)
            throw new ArgumentException($"Sheet {sheet.Number} at {Dpi} dpi would be {width} x {height} px; choose another resolution.");

        var info = new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Opaque);
        using var bitmap = new SKBitmap(info);
        using (var canvas = new SKCanvas(bitmap))
        {
            canvas.Clear(SKColors.White);
            double pixelsPerMm = Dpi / 25.4;
            canvas.Scale((float)pixelsPerMm);
            SkiaSheetPainter.Paint(canvas, sheet, styles, minimumStrokeMm: 1 / pixelsPerMm);
        }

        byte[] png;
        // The Sub filter suits line art on white: in a trial on an A4 page at 300 dpi it encoded about
        // twice as fast and a third smaller than the encoder's default filter choice.
        using (SKPixmap pixmap = bitmap.PeekPixels())
        using (SKData? data = pixmap.Encode(new SKPngEncoderOptions(SKPngEncoderFilterFlags.Sub, 6)))
            png = data?.ToArray() ?? throw new InvalidOperationException("SkiaSharp could not encode the PNG.");
        byte[] withPhys = PngChunks.SetPhysicalResolution(png, PixelsPerMetre);
        output.Write(withPhys, 0, withPhys.Length);
    }
}
