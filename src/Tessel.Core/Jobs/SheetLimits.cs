namespace Tessel.Core.Jobs;

/// <summary>What each sheet format can hold, checked when a job loads so that a sheet no writer can
/// produce is refused before the fit rather than failing after it.</summary>
public static class SheetLimits
{
    /// <summary>Largest PDF page side in millimetres: 14,400 user units of 1/72 inch, the page-size
    /// limit of ISO 32000-1:2008 Annex C.2 (200 inches).</summary>
    public const double MaxPdfPageMm = 14_400 / 72.0 * 25.4;

    /// <summary>Largest PNG side in pixels the sheet writer renders.</summary>
    public const int MaxPngPixelsPerSide = 30_000;

    /// <summary>Largest PNG raster in bytes (4 per pixel): half of what SkiaSharp's int byte count of a
    /// bitmap can address (2^31 - 1), which keeps an A0 sheet at 300 dpi (0.56 GB).</summary>
    public const long MaxPngBytes = 1L << 30;

    /// <summary>The resolution PNG sheets are written at when the sheet allows it.</summary>
    public const int PreferredPngDpi = 300;

    /// <summary>Resolutions tried from the preferred one down, in order.</summary>
    private static readonly int[] Resolutions = [300, 200, 150, 100, 75, 50, 25, 10];

    /// <summary>The highest resolution in <see cref="Resolutions"/> at which a sheet of the given size
    /// fits <see cref="MaxPngPixelsPerSide"/> and <see cref="MaxPngBytes"/>; null when even 10 dpi does not.</summary>
    public static int? PngDpi(double widthMm, double heightMm)
    {
        foreach (int dpi in Resolutions)
        {
            double w = Math.Round(widthMm / 25.4 * dpi), h = Math.Round(heightMm / 25.4 * dpi);
            if (w <= MaxPngPixelsPerSide && h <= MaxPngPixelsPerSide && w * h * 4 <= MaxPngBytes) return dpi;
        }
        return null;
    }

    /// <summary>Bytes of the PNG raster of one sheet at <see cref="PngDpi"/> (0 when PNG is off or impossible).</summary>
    public static double PngRasterBytes(double widthMm, double heightMm) => PngDpi(widthMm, heightMm) is int dpi
        ? Math.Round(widthMm / 25.4 * dpi) * Math.Round(heightMm / 25.4 * dpi) * 4
        : 0;

    /// <summary>A note for the user when PNG sheets are written below <see cref="PreferredPngDpi"/>; null otherwise.</summary>
    public static string? PngNote(double widthMm, double heightMm) => PngDpi(widthMm, heightMm) is int dpi && dpi < PreferredPngDpi
        ? $"PNG sheets are written at {dpi} dpi, not {PreferredPngDpi}: a {widthMm:0.#} x {heightMm:0.#} mm sheet at {PreferredPngDpi} dpi would be a {Math.Round(widthMm / 25.4 * PreferredPngDpi) * Math.Round(heightMm / 25.4 * PreferredPngDpi) * 4 / 1e9:0.#} GB image; cut from the SVG, DXF or PDF, which keep every line exact"
        : null;

    /// <summary>Throws <see cref="JobError"/> when an output format the job asks for cannot hold its sheet.</summary>
    public static void Check(string where, double widthMm, double heightMm, bool pdf, bool png)
    {
        double longer = Math.Max(widthMm, heightMm);
        if (pdf && longer > MaxPdfPageMm)
            throw new JobError(where, $"a {widthMm:0.#} x {heightMm:0.#} mm sheet is larger than a PDF page can be ({MaxPdfPageMm:0} mm, 14,400 pt, ISO 32000-1); use a smaller sheet or set outputs.pdf to false");
        if (png && PngDpi(widthMm, heightMm) is null)
            throw new JobError(where, $"a {widthMm:0.#} x {heightMm:0.#} mm sheet is too large for a PNG even at 10 dpi ({MaxPngPixelsPerSide:#,0} pixels a side at most); use a smaller sheet or set outputs.png to false");
    }
}
