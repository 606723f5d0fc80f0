using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;
using Tessel.Output.Sheets;

namespace Tessel.Output.Writers;

/// <summary>Writes crease-pattern.svg: the whole flat crease pattern at model scale on one true-size
/// drawing with a 10 mm border (boundary as cut, mountain, valley and flat creases in their own layers)
/// and a legend strip under it. A drawing to read, not a sheet to cut: it is not split to fit a sheet.</summary>
public static class CreasePatternSvgWriter
{
    /// <summary>Border around the pattern and the strip, mm.</summary>
    public const double BorderMm = 10;

    /// <summary>Narrowest legend strip of the drawing (the title, print check and legend blocks side by
    /// side need about this much at the sheets' text height).</summary>
    public const double MinimumLegendWidthMm = 240;

    /// <summary>SVG bytes of <see cref="Layout"/>.</summary>
    public static byte[] Write(FlatPattern flat, double scaleDenominator, string jobName, LineStyleTable styles) =>
        SheetWriterBytes.Of(new SvgSheetWriter(), [Layout(flat, scaleDenominator, jobName, styles)], styles);

    /// <summary>The drawing as one sheet, millimetres, y down.</summary>
    /// <param name="flat">Flat pattern in metres at full scale.</param>
    /// <param name="scaleDenominator">n of the model scale 1:n.</param>
    /// <param name="jobName">Shown in the title block.</param>
    /// <param name="styles">The job's line styles, for the legend.</param>
    public static Sheet Layout(FlatPattern flat, double scaleDenominator, string jobName, LineStyleTable styles)
    {
        double k = 1000.0 / scaleDenominator, border = BorderMm;
        // Turned onto its minimum-area rectangle, wider than tall, as the sheets turn their parts.
        var points = Enumerable.Range(0, flat.VertexCount).Select(flat.Vertex).ToArray();
        var box = MinimumAreaRectangle.Of(MinimumAreaRectangle.ConvexHull(points));
        double angle = box.Width >= box.Height ? box.Angle : box.Angle + Math.PI / 2;
        var turned = points.Select(p => p.Rotated(angle)).ToArray();
        double minX = turned.Min(p => p.X), maxX = turned.Max(p => p.X), minY = turned.Min(p => p.Y), maxY = turned.Max(p => p.Y);
        Vec2 At(int v) { var p = turned[v]; return new Vec2((p.X - minX) * k + border, (maxY - p.Y) * k + border); }
        var lines = new List<SheetLine>();
        for (int e = 0; e < flat.EdgeCount; e++)
        {
            var cls = flat.Role(e) switch
            {
                CreaseRole.Mountain => LineClass.Mountain,
                CreaseRole.Valley => LineClass.Valley,
                CreaseRole.Boundary => LineClass.CutOutline,
                CreaseRole.Flat => LineClass.FlatCrease,
                _ => (LineClass?)null,
            };
            if (cls is null) continue;
            var (a, b) = flat.Edge(e);
            lines.Add(new SheetLine(cls.Value, [At(a), At(b)]));
        }
        var content = new AnnotationContent(jobName, 1, $"1:{scaleDenominator:0.###}", IncludeCautions: false,
            Heading: "CREASE PATTERN OF THE WHOLE MODEL - A DRAWING, NOT A SHEET TO CUT");
        double width = Math.Max((maxX - minX) * k + 2 * border, MinimumLegendWidthMm + 2 * border);
        var classes = lines.Select(l => l.Class).Distinct().ToArray();
        double strip = SheetAnnotations.RequiredStripHeight(width - 2 * border, content, styles, classes);
        double patternBottom = (maxY - minY) * k + border;
        var sheet = new Sheet(1, width, patternBottom + border + strip + border, lines.ToArray());
        return SheetAnnotations.AddToStrip(sheet, new SheetRegion(border, patternBottom + border, width - 2 * border, strip), content, styles).Sheet;
    }
}
