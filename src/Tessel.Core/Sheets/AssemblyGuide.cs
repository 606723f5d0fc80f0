using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Unfolding;

namespace Tessel.Core.Sheets;

/// <summary>File names of the sheet jobs, shared by the writers and by the text on the sheets.</summary>
public static class SheetFiles
{
    /// <summary>"sheet-01" for a front job, "sheet-01-back" for the mirrored back job (no extension).</summary>
    public static string BaseName(Sheet sheet) =>
        $"sheet-{sheet.Number.ToString("00", CultureInfo.InvariantCulture)}{(sheet.Side == "front" ? "" : "-" + sheet.Side)}";
}

/// <summary>The cover sheet as an assembly guide: title, print check and legend; a key plan of the
/// whole flat pattern with part outlines, part numbers and seam codes; a small picture of the folded
/// model; every sheet file in cutting order; how to register a back job; a folding order; the cautions.
/// Everything is <see cref="LineClass.Annotation"/> (printed, never cut).</summary>
public static class AssemblyGuide
{
    /// <summary>Heading of the cover's title block (instead of a sheet number: the cover is not a sheet to cut).</summary>
    public const string Heading = "COVER - ASSEMBLY GUIDE (NOTHING TO CUT ON THIS PAGE)";

    /// <summary>Folding order in the words makers use: pre-crease every line flat, then collapse
    /// gradually from one edge (common practice, no source).</summary>
    public static IReadOnlyList<string> FoldingOrder { get; } =
    [
        "1. Cut every sheet in the order above; keep parts flat until all are cut.",
        "2. Pre-crease every line on its own first: fold each mountain and each valley fully, then open the sheet flat again.",
        "3. Glue seams with matching codes, tab under the plain edge, before collapsing (part numbers read upright on the key plan).",
        "4. Collapse row by row from one short edge: bring the first row of creases in together, then the next, nudging every crease a little at a time.",
        "5. Ease the model to its shape on the picture; do not press it flat.",
    ];

    /// <summary>Builds the cover. <paramref name="layout"/> gives the parts and seams and the sheets in
    /// cutting order; <paramref name="fileTypes"/> the file extensions written per sheet (".svg", ".dxf").</summary>
    public static AnnotationPlacement Cover(double widthMm, double heightMm, double marginMm, AnnotationContent content,
        LineStyleTable styles, SheetLayoutResult layout, FlatPattern flat, IReadOnlyList<string> fileTypes)
    {
        double h = content.TextHeightMm, body = 0.8 * h, gap = 3 * h;
        var region = new SheetRegion(marginMm, marginMm, widthMm - 2 * marginMm, heightMm - 2 * marginMm);
        var inUse = LineStyleTable.FabricationOrder
            .Where(c => c != LineClass.Annotation && layout.Sheets.Any(s => s.Lines.Any(l => l.Class == c))).ToArray();
        var head = SheetAnnotations.Blocks(0, "cover", content with { Heading = Heading, IncludeCautions = false, CautionLine = false },
            styles, inUse, region.Height, region.Width);
        var (lines, omitted, used) = SheetAnnotations.Flow(head, region, h);

        var rest = new SheetRegion(region.X, region.Y + used + gap, region.Width, region.Height - used - gap);
        bool sideBySide = rest.Width >= rest.Height;
        // A long list of sheets or a small cover leaves less room for the text: the key plan gives way
        // first, then the body text shrinks (not below 0.6 of the title height).
        List<SheetLine> best = [];
        List<string> bestOmitted = [];
        var tries = new[] { (0.55, 0.8, true), (0.45, 0.7, true), (0.4, 0.6, true), (0.33, 0.6, true), (0.25, 0.6, true),
            (0.25, 0.6, false), (0.15, 0.6, false) };
        foreach (var (planShare, bodyShare, picture) in tries)
        {
            var (guide, missing) = Guide(rest, sideBySide, planShare, bodyShare * h, picture, content, layout, flat, fileTypes);
            best = guide;
            bestOmitted = missing;
            if (missing.Count == 0) break;
        }
        lines.AddRange(best);
        omitted.AddRange(bestOmitted);
        var sheet = new Sheet(0, widthMm, heightMm, lines.ToArray()) { Side = "cover" };
        return new AnnotationPlacement(sheet, omitted, region.Height);
    }

    private static (List<SheetLine> Lines, List<string> Omitted) Guide(SheetRegion rest, bool sideBySide, double planShare,
        double body, bool picture, AnnotationContent content, SheetLayoutResult layout, FlatPattern flat, IReadOnlyList<string> fileTypes)
    {
        double h = content.TextHeightMm, gap = 3 * h;
        SheetRegion planArea, textArea;
        if (sideBySide)
        {
            double planW = planShare * rest.Width;
            planArea = rest with { Width = planW };
            textArea = rest with { X = rest.X + planW + gap, Width = rest.Width - planW - gap };
        }
        else
        {
            double planH = planShare * rest.Height;
            planArea = rest with { Height = planH };
            textArea = rest with { Y = rest.Y + planH + gap, Height = rest.Height - planH - gap };
        }
        var lines = new List<SheetLine>();
        var omitted = new List<string>();
        if (planArea.Width > 20 && planArea.Height > 20) lines.AddRange(KeyPlan(planArea, layout, flat, h));
        else omitted.Add("key plan");

        var blocks = new List<SheetAnnotations.Block>();
        double pictureW = Math.Min(textArea.Width, 70), pictureH = Math.Min(0.3 * textArea.Height, 45);
        if (picture && pictureW > 20 && pictureH > 15) blocks.Add(FoldedPicture(flat, pictureW, pictureH, h));
        else if (picture) omitted.Add("folded model");
        blocks.Add(Paragraphs("files", "SHEETS IN CUTTING ORDER", [CuttingOrder(layout.Sheets, fileTypes)], textArea.Width, h, body));
        if (layout.Sheets.Any(s => s.Side != "front"))
            blocks.Add(Paragraphs("back jobs", "REGISTERING A BACK JOB", BackJobSteps, textArea.Width, h, body));
        blocks.Add(Paragraphs("folding order", "FOLDING ORDER", FoldingOrder, textArea.Width, h, body));
        if (content.IncludeCautions)
            blocks.Add(Paragraphs("cautions", "CAUTIONS", SheetAnnotations.CautionParagraphs, textArea.Width, h, body));
        // One column: each block under the previous one.
        var stacked = blocks.Select(b => b with { Width = Math.Max(b.Width, textArea.Width) }).ToList();
        var (textLines, textOmitted, _) = SheetAnnotations.Flow(stacked, textArea, h);
        lines.AddRange(textLines);
        omitted.AddRange(textOmitted);
        return (lines, omitted);
    }

    /// <summary>How a back job lines up with its front job: the back job is mirrored (x' = W - x), so
    /// the sheet turns over about its vertical centre line (common practice; expect 0.2-0.5 mm).</summary>
    public static IReadOnlyList<string> BackJobSteps { get; } =
    [
        "Each -back file is the mirrored back job of the sheet with the same number; run it first, on the blank sheet.",
        "Then turn the sheet over about its vertical centre line (left edge to right, top edge stays at the top) and push it into the same corner stop on the bed.",
        "The four L-shaped corner marks are the same on both jobs: on a print, hold the sheet to the light and the front and back marks must coincide. Expect 0.2 to 0.5 mm.",
        "Run the front job last: it holds the through-cuts.",
    ];

    /// <summary>"1. SHEET-01-BACK (.SVG .DXF) - BACK JOB; 2. SHEET-01 ..." in layout (cutting) order.</summary>
    public static string CuttingOrder(IReadOnlyList<Sheet> sheets, IReadOnlyList<string> fileTypes)
    {
        string types = fileTypes.Count == 0 ? "" : " (" + string.Join(" ", fileTypes) + ")";
        return string.Join("; ", sheets.Select((s, i) => string.Create(CultureInfo.InvariantCulture,
            $"{i + 1}. {SheetFiles.BaseName(s)}{types}{(s.Side == "front" ? "" : " - back job, mirrored")}"))) + ".";
    }

    private static SheetAnnotations.Block Paragraphs(string name, string caption, IReadOnlyList<string> paragraphs, double width, double h, double body)
    {
        var lines = new List<SheetLine>();
        lines.AddRange(SheetAnnotations.Text(caption, new Vec2(0, h), h));
        double pitch = StrokeFont.LineSpacing * body, y = h + StrokeFont.LineSpacing * h;
        double widest = StrokeFont.Measure(caption, h);
        foreach (string p in paragraphs)
            foreach (string line in SheetAnnotations.Wrap(p, width, body))
            {
                lines.AddRange(SheetAnnotations.Text(line, new Vec2(0, y), body));
                widest = Math.Max(widest, StrokeFont.Measure(line, body));
                y += pitch;
            }
        double descent = StrokeFont.DescenderUnits / StrokeFont.CapHeightUnits * body;
        return new SheetAnnotations.Block(name, widest, y - pitch + descent, lines);
    }

    /// <summary>The flat pattern fitted into <paramref name="area"/>: part outlines (edges between two
    /// parts, and the pattern's boundary), each part's number at its middle facet, each seam's code at
    /// the middle of its edge.</summary>
    internal static List<SheetLine> KeyPlan(SheetRegion area, SheetLayoutResult layout, FlatPattern flat, double h)
    {
        var lines = new List<SheetLine>();
        string caption = "KEY PLAN: PART NUMBERS, SEAM CODES (FRONT UP)";
        var captionLines = SheetAnnotations.Wrap(caption, area.Width, 0.8 * h);
        for (int i = 0; i < captionLines.Count; i++)
            lines.AddRange(SheetAnnotations.Text(captionLines[i], new Vec2(area.X, area.Y + h + i * StrokeFont.LineSpacing * 0.8 * h), 0.8 * h));
        var mesh = flat.Folded;
        var partOf = Enumerable.Repeat(-1, mesh.FaceCount).ToArray();
        foreach (var part in layout.Parts)
            foreach (int f in part.Faces) partOf[f] = part.Number;
        // Flat pattern with y flipped, as the sheets show it, turned onto its minimum-area rectangle
        // (as the sheets turn their parts) in whichever of the two turnings draws it larger.
        var flipped = Enumerable.Range(0, flat.VertexCount).Select(v => new Vec2(flat.Vertex(v).X, -flat.Vertex(v).Y)).ToArray();
        var box = MinimumAreaRectangle.Of(MinimumAreaRectangle.ConvexHull(flipped));
        double top = area.Y + 1.5 * h + captionLines.Count * StrokeFont.LineSpacing * 0.8 * h;
        double availW = area.Width, availH = area.Bottom - top;
        Vec2[] p = [];
        double s = 0, minX = 0, maxX = 0, minY = 0, maxY = 0;
        foreach (double angle in new[] { box.Angle, box.Angle + Math.PI / 2 })
        {
            var turned = flipped.Select(q => q.Rotated(angle)).ToArray();
            double x0 = turned.Min(q => q.X), x1 = turned.Max(q => q.X), y0 = turned.Min(q => q.Y), y1 = turned.Max(q => q.Y);
            double scale = Math.Min(availW / Math.Max(x1 - x0, 1e-12), availH / Math.Max(y1 - y0, 1e-12));
            if (scale <= s * (1 + 1e-9)) continue;
            (p, s, minX, maxX, minY, maxY) = (turned, scale, x0, x1, y0, y1);
        }
        double ox = area.X + (availW - (maxX - minX) * s) / 2, oy = top;
        Vec2 At(Vec2 q) => new(ox + (q.X - minX) * s, oy + (q.Y - minY) * s);
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int l = mesh.EdgeFaceLeft[e], r = mesh.EdgeFaceRight[e];
            bool outline = l < 0 || r < 0 || partOf[l] != partOf[r];
            if (!outline) continue;
            var (a, b) = flat.Edge(e);
            lines.Add(new SheetLine(LineClass.Annotation, [At(p[a]), At(p[b])]));
        }
        double labelH = Math.Clamp(0.35 * Math.Sqrt(availW * availH / Math.Max(1, layout.Parts.Length)) / 3, 1.5, 2 * h);
        foreach (var part in layout.Parts)
        {
            var centroids = part.Faces.Select(f => Centroid(mesh.Faces[f].Select(v => p[v]))).ToArray();
            var mean = Centroid(centroids);
            var middle = centroids.MinBy(c => (c - mean).Length);
            lines.AddRange(SheetAnnotations.Text(part.Number.ToString(CultureInfo.InvariantCulture), At(middle), labelH, TextAnchor.MiddleCentre));
        }
        foreach (var seam in layout.Seams)
        {
            var (a, b) = flat.Edge(seam.Edge);
            // As large as the part numbers allow, but no wider than most of its edge on the plan.
            double alongEdge = (At(p[a]) - At(p[b])).Length;
            double seamH = Math.Max(1.0, Math.Min(0.6 * labelH, 0.8 * alongEdge / Math.Max(1, StrokeFont.Measure(seam.Code, 1))));
            lines.AddRange(SheetAnnotations.Text(seam.Code, At((p[a] + p[b]) * 0.5), seamH, TextAnchor.MiddleCentre));
        }
        return lines;
    }

    /// <summary>A wireframe of the folded model seen obliquely from above (30 degrees about the vertical,
    /// 35 degrees down), fitted into a box <paramref name="width"/> x <paramref name="height"/> under a caption.</summary>
    internal static SheetAnnotations.Block FoldedPicture(FlatPattern flat, double width, double height, double h)
    {
        var mesh = flat.Folded;
        double yaw = 30 * Math.PI / 180, pitch = 35 * Math.PI / 180;
        var q = new Vec2[mesh.VertexCount];
        for (int v = 0; v < q.Length; v++)
        {
            var x = mesh.Vertex(v);
            double u = x.X * Math.Cos(yaw) - x.Y * Math.Sin(yaw);
            double depth = x.X * Math.Sin(yaw) + x.Y * Math.Cos(yaw);
            q[v] = new Vec2(u, -(x.Z * Math.Cos(pitch) + depth * Math.Sin(pitch)));
        }
        double minX = q.Min(a => a.X), maxX = q.Max(a => a.X), minY = q.Min(a => a.Y), maxY = q.Max(a => a.Y);
        double top = 1.8 * h;
        double s = Math.Min(width / Math.Max(maxX - minX, 1e-12), (height - top) / Math.Max(maxY - minY, 1e-12));
        var lines = new List<SheetLine>();
        lines.AddRange(SheetAnnotations.Text("FOLDED MODEL", new Vec2(0, h), 0.8 * h));
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
            Vec2 A = new((q[a].X - minX) * s, top + (q[a].Y - minY) * s), B = new((q[b].X - minX) * s, top + (q[b].Y - minY) * s);
            lines.Add(new SheetLine(LineClass.Annotation, [A, B]));
        }
        return new SheetAnnotations.Block("folded model", Math.Max((maxX - minX) * s, StrokeFont.Measure("FOLDED MODEL", 0.8 * h)),
            top + (maxY - minY) * s, lines);
    }

    private static Vec2 Centroid(IEnumerable<Vec2> points)
    {
        double x = 0, y = 0;
        int n = 0;
        foreach (var a in points) { x += a.X; y += a.Y; n++; }
        return new Vec2(x / n, y / n);
    }
}
