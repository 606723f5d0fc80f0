namespace Tessel.Output.Sheets;

/// <summary>Looks sheet writers up by format name ("svg", "dxf", "pdf", "png"), for the command line
/// and the build runner.</summary>
public static class SheetWriterFormats
{
    /// <summary>The format names, in the order a build writes them.</summary>
    public static IReadOnlyList<string> Names { get; } = ["svg", "dxf", "pdf", "png"];

    /// <summary>A writer for <paramref name="format"/> (case-insensitive); <paramref name="pngDpi"/>
    /// applies to PNG only.</summary>
    /// <exception cref="ArgumentException">Unknown format name.</exception>
    public static ISheetWriter Create(string format, int pngDpi = PngSheetWriter.DefaultDpi) =>
        format.Trim().ToLowerInvariant() switch
        {
            "svg" => new SvgSheetWriter(),
            "dxf" => new DxfSheetWriter(),
            "pdf" => new PdfSheetWriter(),
            "png" => new PngSheetWriter(pngDpi),
            _ => throw new ArgumentException($"Unknown sheet format '{format}'; use one of {string.Join(", ", Names)}.", nameof(format)),
        };
}
