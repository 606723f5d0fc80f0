using System.Text;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Writes one sheet as an SVG 1.1 file at true size: width and height in millimetres and a
/// viewBox in millimetres, so one user unit is one millimetre and the file prints and imports at
/// 100 %. One group per layer (in <see cref="LineStyleTable.FabricationOrder"/>), stroke only, no
/// fills; labels are already stroke-font polylines and are written as paths like every other line.</summary>
public sealed class SvgSheetWriter : ISheetWriter
{
    /// <summary>SVG sheets for cutters and viewers, cover included, cutter hairlines.</summary>
    public static SheetFormat Format { get; } = new("svg", ".svg", "svg", o => o.Svg,
        CarriesCover: true, OneFilePerSheet: true, ForPrinting: false, _ => new SvgSheetWriter());

    /// <inheritdoc/>
    public string FileExtension => Format.FileExtension;

    /// <inheritdoc/>
    public bool OneFilePerSheet => Format.OneFilePerSheet;

    /// <inheritdoc/>
    public void Write(IReadOnlyList<Sheet> sheets, LineStyleTable styles, Stream output) =>
        Write(SheetWriterGuard.Single(sheets, "SVG"), styles, output);

    /// <summary>Writes <paramref name="sheet"/> to <paramref name="output"/> as UTF-8 SVG.</summary>
    public void Write(Sheet sheet, LineStyleTable styles, Stream output)
    {
        SheetWriterGuard.Check(sheet);
        ArgumentNullException.ThrowIfNull(styles);
        ArgumentNullException.ThrowIfNull(output);

        var svg = new StringBuilder();
        string w = SheetNumberFormat.Mm(sheet.WidthMm), h = SheetNumberFormat.Mm(sheet.HeightMm);
        svg.Append("<?xml version=\"1.0\" encoding=\"UTF-8\" standalone=\"no\"?>\n");
        svg.Append("<!-- ").Append(Comment($"Tessel fabrication sheet {sheet.Number} ({sheet.Side}), {w} x {h} mm. One user unit = 1 mm; print or import at 100 %.")).Append(" -->\n");
        svg.Append("<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" ")
           .Append($"width=\"{w}mm\" height=\"{h}mm\" viewBox=\"0 0 {w} {h}\">\n");
        svg.Append("  <title>").Append(Text($"Sheet {sheet.Number} ({sheet.Side})")).Append("</title>\n");

        string strokeWidth = SheetNumberFormat.Mm(styles.StrokeWidthMm);
        foreach (LineClass lineClass in LineStyleTable.FabricationOrder)
        {
            LineStyle style = styles[lineClass];
            svg.Append("  <g id=\"").Append(Attribute(style.LayerName))
               .Append("\" data-line-class=\"").Append(lineClass)
               .Append("\" data-operation=\"").Append(style.Operation.ToString().ToLowerInvariant())
               .Append("\" fill=\"none\" stroke=\"").Append(Attribute(style.ColourHex))
               .Append("\" stroke-width=\"").Append(strokeWidth)
               .Append("\" stroke-linecap=\"butt\" stroke-linejoin=\"round\"");
            double[] dashes = styles.DashLengthsMm(lineClass);
            if (dashes.Length > 0)
                svg.Append(" stroke-dasharray=\"").Append(string.Join(" ", dashes.Select(SheetNumberFormat.Mm))).Append('"');
            svg.Append(">\n");
            svg.Append("    <title>").Append(Text(style.DisplayName)).Append("</title>\n");
            foreach (SheetLine line in SheetWriterGuard.LinesOf(sheet, lineClass))
                svg.Append("    <path d=\"").Append(PathData(line)).Append("\"/>\n");
            svg.Append("  </g>\n");
        }
        svg.Append("</svg>\n");

        byte[] bytes = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false).GetBytes(svg.ToString());
        output.Write(bytes, 0, bytes.Length);
    }

    private static string PathData(SheetLine line)
    {
        var d = new StringBuilder();
        for (int i = 0; i < line.Points.Length; i++)
        {
            d.Append(i == 0 ? "M" : " L")
             .Append(SheetNumberFormat.Mm(line.Points[i].X)).Append(',')
             .Append(SheetNumberFormat.Mm(line.Points[i].Y));
        }
        if (line.Closed) d.Append(" Z");
        return d.ToString();
    }

    /// <summary>Escapes text for an XML attribute value in double quotes.</summary>
    internal static string Attribute(string s) => Text(s).Replace("\"", "&quot;").Replace("'", "&apos;");

    /// <summary>Escapes XML character data, dropping characters XML 1.0 forbids.</summary>
    internal static string Text(string s)
    {
        var sb = new StringBuilder(s.Length);
        foreach (char c in s)
        {
            if (c < 0x20 && c is not '\t' and not '\n' and not '\r') continue;
            if (c is '\uFFFE' or '\uFFFF') continue;
            sb.Append(c switch { '&' => "&amp;", '<' => "&lt;", '>' => "&gt;", _ => c.ToString() });
        }
        return sb.ToString();
    }

    /// <summary>Makes text safe inside an XML comment: no "--" and no trailing '-'.</summary>
    internal static string Comment(string s)
    {
        string t = Text(s);
        while (t.Contains("--")) t = t.Replace("--", "- -");
        return t.EndsWith('-') ? t + " " : t;
    }
}
