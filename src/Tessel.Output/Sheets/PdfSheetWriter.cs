using SkiaSharp;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Writes all sheets into one PDF, one page per sheet at 100 %: the page is the sheet's
/// size in points (1 pt = 1/72 in, ISO 32000-1), so A4 is 595.28 x 841.89 pt. Lines are vectors
/// drawn with the style table; labels are stroke-font lines, so no fonts are embedded.</summary>
/// <remarks>
/// Deterministic: the metadata is fixed (title, creator, producer) and carries no dates; without
/// PDF/A, Skia writes no document /ID and no XMP packet (both would hold clock-derived values), and
/// the tests check that this stays so. Skia rounds each page's MediaBox to whole points
/// (A4 would become 595 x 842), so <see cref="PdfMediaBoxPatch"/> puts the exact size back.
/// </remarks>
public sealed class PdfSheetWriter : ISheetWriter
{
    /// <summary>Points per millimetre: 72 pt per inch / 25.4 mm per inch.</summary>
    public const double PointsPerMm = 72.0 / 25.4;

    /// <summary>One PDF of the cover and every sheet, for printing at true size.</summary>
    public static SheetFormat Format { get; } = new("pdf", ".pdf", "pdf", o => o.Pdf,
        CarriesCover: true, OneFilePerSheet: false, ForPrinting: true,
        o => o.JobName is null ? new PdfSheetWriter() : new PdfSheetWriter { Title = $"Tessel sheets: {o.JobName}" });

    /// <inheritdoc/>
    public string FileExtension => Format.FileExtension;

    /// <inheritdoc/>
    public bool OneFilePerSheet => Format.OneFilePerSheet;

    /// <summary>Document title written into the PDF metadata.</summary>
    public string Title { get; init; } = "Tessel fabrication sheets";

    /// <inheritdoc/>
    public void Write(IReadOnlyList<Sheet> sheets, LineStyleTable styles, Stream output)
    {
        ArgumentNullException.ThrowIfNull(sheets);
        ArgumentNullException.ThrowIfNull(styles);
        ArgumentNullException.ThrowIfNull(output);
        if (sheets.Count == 0) throw new ArgumentException("A PDF needs at least one sheet.", nameof(sheets));
        foreach (Sheet s in sheets) SheetWriterGuard.Check(s);

        using var buffer = new MemoryStream();
        var metadata = new SKDocumentPdfMetadata
        {
            Title = Title,
            Creator = "Tessel",
            Producer = "Tessel",
            Creation = null,
            Modified = null,
            RasterDpi = SKDocumentPdfMetadata.DefaultRasterDpi,
            EncodingQuality = SKDocumentPdfMetadata.DefaultEncodingQuality,
            PdfA = false,
        };
        using (var managed = new SKManagedWStream(buffer))
        using (SKDocument document = SKDocument.CreatePdf(managed, metadata))
        {
            foreach (Sheet sheet in sheets)
            {
                SKCanvas canvas = document.BeginPage((float)(sheet.WidthMm * PointsPerMm), (float)(sheet.HeightMm * PointsPerMm));
                canvas.Scale((float)PointsPerMm);
                SkiaSheetPainter.Paint(canvas, sheet, styles, minimumStrokeMm: 0);
                document.EndPage();
            }
            document.Close();
        }

        byte[] pdf = PdfMediaBoxPatch.Apply(buffer.ToArray(),
            sheets.Select(s => (s.WidthMm * PointsPerMm, s.HeightMm * PointsPerMm)).ToArray());
        output.Write(pdf, 0, pdf.Length);
    }

    /// <summary>Convenience overload for a single sheet.</summary>
    public void Write(Sheet sheet, LineStyleTable styles, Stream output) => Write([sheet], styles, output);
}
