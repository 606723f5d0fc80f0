namespace Tessel.Output.Sheets;

/// <summary>The sheet formats a build can write, in the order it writes them. A new format is a writer
/// file that declares its <see cref="SheetFormat"/> plus one line here.</summary>
public static class SheetFormats
{
    /// <summary>Every registered format.</summary>
    public static IReadOnlyList<SheetFormat> All { get; } =
    [
        SvgSheetWriter.Format,
        DxfSheetWriter.Format,
        PdfSheetWriter.Format,
        PngSheetWriter.Format,
    ];

    /// <summary>The format names, in the order a build writes them.</summary>
    public static IReadOnlyList<string> Names { get; } = All.Select(f => f.Name).ToArray();

    /// <summary>The format called <paramref name="name"/> (case-insensitive, blanks ignored).</summary>
    /// <exception cref="ArgumentException">Unknown format name.</exception>
    public static SheetFormat Find(string name) =>
        All.FirstOrDefault(f => f.Name == name.Trim().ToLowerInvariant())
        ?? throw new ArgumentException($"Unknown sheet format '{name}'; use one of {string.Join(", ", Names)}.", nameof(name));

    /// <summary>A writer for <paramref name="format"/> outside a build; <paramref name="pngDpi"/> applies
    /// to raster formats only.</summary>
    /// <exception cref="ArgumentException">Unknown format name.</exception>
    public static ISheetWriter Create(string format, int pngDpi = PngSheetWriter.DefaultDpi) =>
        Find(format).CreateWriter(new SheetWriterOptions(null, pngDpi));
}
