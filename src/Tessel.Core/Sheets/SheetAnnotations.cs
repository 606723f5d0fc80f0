using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>Builds the printed-only information of a sheet as <see cref="LineClass.Annotation"/>
/// lines in the <see cref="StrokeFont"/>: title (job, sheet number, side, scale), a print check
/// (100 mm scale bar and 10 mm square), a legend of the line classes in use, and the safety cautions.
/// Everything goes into a caller-given region that must be clear of the parts, or onto a cover sheet.</summary>
/// <remarks>
/// The legend's line samples are annotation lines too (so a legend is never cut or scored); they
/// reproduce each class's dash pattern as separate strokes, and the text names the class's colour,
/// cutter operation and layer, so the legend reads correctly on a greyscale print and in DXF.
/// </remarks>
public static class SheetAnnotations
{
    /// <summary>Length of the scale bar, in millimetres.</summary>
    public const double ScaleBarLengthMm = 100;

    /// <summary>Side of the print-check square, in millimetres.</summary>
    public const double CheckSquareMm = 10;

    /// <summary>Length of a legend's line sample, in millimetres.</summary>
    public const double LegendSampleMm = 15;

    /// <summary>The safety cautions printed on every sheet (or the cover sheet), one paragraph each.</summary>
    public static IReadOnlyList<string> CautionParagraphs { get; } =
    [
        "CAUTION - laser: work only under your workshop's rules, the machine maker's instructions and the training you were given; never leave the machine running unattended. Keep fume extraction and air assist on and a CO2 extinguisher at hand.",
        "Fumes: polypropylene and adhesives give off fumes when cut or glued; ventilate the room and follow each product's safety data sheet.",
        "Never laser-cut PVC or vinyl (gives off hydrogen chloride and chlorine), PTFE, polycarbonate or ABS, or board of unknown make-up; read the material's safety data sheet.",
        "Hand cutting: sharp blade, steel rule and cutting mat; cut away from your body; used blades into a sharps container.",
        "A scale model is for study, not a structural check: loads, connections, fire and code compliance need a licensed engineer under local codes.",
    ];

    /// <summary>The caution printed on every part sheet and in the terminal summary: short, and deferring
    /// to the workshop's rules rather than replacing them.</summary>
    public const string CautionLine =
        "CAUTION: laser only under your workshop's rules, the machine maker's instructions and your training; never PVC or vinyl; ventilate fumes from polypropylene and adhesives; a model is not a structural check.";

    internal readonly record struct Block(string Name, double Width, double Height, List<SheetLine> Lines);

    /// <summary>Appends title, print check, legend (for the classes present on the sheet) and cautions
    /// to <paramref name="sheet"/>, flowing the blocks left to right and then downwards inside
    /// <paramref name="strip"/>. Blocks that do not fit are reported, not drawn outside the strip.</summary>
    /// <exception cref="InvalidOperationException">A part line (anything but an annotation) crosses the
    /// strip: annotations would be drawn over parts.</exception>
    public static AnnotationPlacement AddToStrip(Sheet sheet, SheetRegion strip, AnnotationContent content, LineStyleTable styles)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(strip);
        if (!(strip.Width > 0) || !(strip.Height > 0))
            throw new ArgumentException($"The annotation strip needs a positive size, not {strip.Width} x {strip.Height} mm.", nameof(strip));
        foreach (SheetLine line in sheet.Lines)
        {
            if (line.Class == LineClass.Annotation) continue;
            int n = line.Points.Length, segments = line.Closed ? n : n - 1;
            for (int i = 0; i < segments; i++)
                if (strip.SegmentEntersInterior(line.Points[i], line.Points[(i + 1) % n]))
                    throw new InvalidOperationException(
                        $"Sheet {sheet.Number}: a {line.Class} line crosses the annotation strip at ({strip.X}, {strip.Y}, {strip.Width} x {strip.Height} mm).");
        }
        LineClass[] inUse = LineStyleTable.FabricationOrder
            .Where(c => c != LineClass.Annotation && sheet.Lines.Any(l => l.Class == c)).ToArray();
        var (lines, omitted, used) = Flow(Blocks(sheet.Number, sheet.Side, content, styles, inUse, strip.Height, strip.Width), strip, content.TextHeightMm);
        return new AnnotationPlacement(sheet with { Lines = [.. sheet.Lines, .. lines] }, omitted, used);
    }

    /// <summary>The strip height all blocks need when flowed into a strip <paramref name="stripWidthMm"/>
    /// wide (legend in one column), so a layout can reserve it before placing parts.</summary>
    public static double RequiredStripHeight(double stripWidthMm, AnnotationContent content, LineStyleTable styles,
        IEnumerable<LineClass> classesInUse)
    {
        LineClass[] inUse = classesInUse.Where(c => c != LineClass.Annotation).Distinct().ToArray();
        var region = new SheetRegion(0, 0, stripWidthMm, 1e6);
        var blocks = Blocks(1, "front", content, styles, inUse, region.Height, region.Width);
        var (_, omitted, used) = Flow(blocks, region, content.TextHeightMm);
        if (omitted.Count > 0)
            throw new ArgumentException($"A strip {stripWidthMm} mm wide is too narrow for: {string.Join(", ", omitted)}.");
        return used;
    }

    /// <summary>A sheet that carries only annotations (title, print check, legend of
    /// <paramref name="classesInUse"/>, cautions), inside a margin: use it when the part sheets have no
    /// room for a strip.</summary>
    public static AnnotationPlacement CoverSheet(int number, double widthMm, double heightMm, double marginMm,
        AnnotationContent content, LineStyleTable styles, IEnumerable<LineClass> classesInUse)
    {
        var blank = new Sheet(number, widthMm, heightMm, []);
        var region = new SheetRegion(marginMm, marginMm, widthMm - 2 * marginMm, heightMm - 2 * marginMm);
        LineClass[] inUse = LineStyleTable.FabricationOrder.Where(c => c != LineClass.Annotation && classesInUse.Contains(c)).ToArray();
        var (lines, omitted, used) = Flow(Blocks(number, "cover", content, styles, inUse, region.Height, region.Width), region, content.TextHeightMm);
        return new AnnotationPlacement(blank with { Lines = lines.ToArray() }, omitted, used);
    }

    /// <summary>Text as annotation lines (a thin wrapper over <see cref="StrokeFont.Layout"/>).</summary>
    public static SheetLine[] Text(string text, Vec2 origin, double heightMm, TextAnchor anchor = TextAnchor.BaselineLeft) =>
        StrokeFont.Layout(text, origin, heightMm, 0, anchor).Select(s => new SheetLine(LineClass.Annotation, s)).ToArray();

    /// <summary>Breaks <paramref name="paragraph"/> into lines no wider than <paramref name="maxWidthMm"/>
    /// at <paramref name="heightMm"/> (a single word wider than that stays on its own line).</summary>
    public static IReadOnlyList<string> Wrap(string paragraph, double maxWidthMm, double heightMm)
    {
        var lines = new List<string>();
        string current = "";
        foreach (string word in paragraph.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            string candidate = current.Length == 0 ? word : current + " " + word;
            if (current.Length > 0 && StrokeFont.Measure(candidate, heightMm) > maxWidthMm)
            {
                lines.Add(current);
                current = word;
            }
            else current = candidate;
        }
        if (current.Length > 0) lines.Add(current);
        return lines;
    }

    /// <summary>The 100 mm scale bar with a tick every 10 mm and labels 0, 50, 100 MM, its left end
    /// at <paramref name="leftEnd"/> (ticks and labels above the bar).</summary>
    public static SheetLine[] ScaleBar(Vec2 leftEnd, double textHeightMm)
    {
        var lines = new List<SheetLine> { Segment(leftEnd, leftEnd + new Vec2(ScaleBarLengthMm, 0)) };
        for (int mm = 0; mm <= ScaleBarLengthMm; mm += 10)
        {
            double tick = mm % 50 == 0 ? 3 : 1.5;
            var at = leftEnd + new Vec2(mm, 0);
            lines.Add(Segment(at, at - new Vec2(0, tick)));
        }
        double labelBaseline = leftEnd.Y - 4;
        lines.AddRange(Text("0", new Vec2(leftEnd.X, labelBaseline), textHeightMm, TextAnchor.BaselineCentre));
        lines.AddRange(Text("50", new Vec2(leftEnd.X + 50, labelBaseline), textHeightMm, TextAnchor.BaselineCentre));
        lines.AddRange(Text("100 MM", new Vec2(leftEnd.X + ScaleBarLengthMm, labelBaseline), textHeightMm, TextAnchor.BaselineRight));
        return lines.ToArray();
    }

    /// <summary>The closed 10 mm print-check square with its top-left corner at <paramref name="topLeft"/>.</summary>
    public static SheetLine CheckSquare(Vec2 topLeft) => new(LineClass.Annotation,
        [topLeft, topLeft + new Vec2(CheckSquareMm, 0), topLeft + new Vec2(CheckSquareMm, CheckSquareMm), topLeft + new Vec2(0, CheckSquareMm)],
        Closed: true);

    /// <summary>A legend sample of <paramref name="lineClass"/>: its display dash pattern reproduced as
    /// separate annotation strokes from <paramref name="start"/> to the right over <see cref="LegendSampleMm"/>.</summary>
    public static SheetLine[] LegendSample(LineClass lineClass, LineStyleTable styles, Vec2 start)
    {
        double[] pattern = styles.DashLengthsMm(lineClass);
        if (pattern.Length == 0) return [Segment(start, start + new Vec2(LegendSampleMm, 0))];
        var strokes = new List<SheetLine>();
        double x = 0;
        for (int i = 0; x < LegendSampleMm; i = (i + 1) % pattern.Length)
        {
            double end = Math.Min(x + pattern[i], LegendSampleMm);
            if (i % 2 == 0) strokes.Add(Segment(start + new Vec2(x, 0), start + new Vec2(end, 0)));
            x = end;
        }
        return strokes.ToArray();
    }

    /// <summary>The legend's words for one class: name, operation, colour and layer.</summary>
    public static string LegendText(LineClass lineClass, LineStyleTable styles)
    {
        LineStyle s = styles[lineClass];
        string operation = s.Operation switch
        {
            LineOperation.Cut => "CUT THROUGH",
            LineOperation.Score => "SCORE",
            LineOperation.Mark => "MARK",
            _ => "PRINT ONLY",
        };
        return $"{s.DisplayName} - {operation} - {s.ColourHex} - {s.LayerName}";
    }

    internal static List<Block> Blocks(int sheetNumber, string side, AnnotationContent content, LineStyleTable styles,
        IReadOnlyList<LineClass> inUse, double availableHeight, double availableWidth)
    {
        double h = content.TextHeightMm;
        if (!(h > 0)) throw new ArgumentOutOfRangeException(nameof(content), h, "Annotation text height must be positive.");
        double pitch = StrokeFont.LineSpacing * h, descent = StrokeFont.DescenderUnits / StrokeFont.CapHeightUnits * h;
        var blocks = new List<Block>();

        // Title: job, sheet, scale.
        string[] title =
        [
            $"JOB: {content.JobName}",
            content.Heading ?? string.Create(CultureInfo.InvariantCulture, $"SHEET {sheetNumber} OF {content.SheetCount} - {side}"),
            $"SCALE {content.ScaleText} - PRINT AT 100 %, NO FIT TO PAGE",
        ];
        blocks.Add(TextBlock("title", title, h));

        // Print check: caption, then scale bar and square sharing a bottom line.
        {
            var lines = new List<SheetLine>();
            lines.AddRange(Text("PRINT CHECK: BAR 100 MM, SQUARE 10 MM", new Vec2(0, h), h));
            double barY = Math.Max(h + 1 + CheckSquareMm, h + pitch + 4 + 3);
            double barX = StrokeFont.Measure("0", h) / 2; // the centred "0" label must not stick out left
            lines.AddRange(ScaleBar(new Vec2(barX, barY), h));
            double squareX = barX + ScaleBarLengthMm + 5;
            lines.Add(CheckSquare(new Vec2(squareX, barY - CheckSquareMm)));
            lines.AddRange(Text("10 MM", new Vec2(squareX + CheckSquareMm + 2, barY), h));
            double width = Math.Max(StrokeFont.Measure("PRINT CHECK: BAR 100 MM, SQUARE 10 MM", h),
                squareX + CheckSquareMm + 2 + StrokeFont.Measure("10 MM", h));
            blocks.Add(new Block("print check", width, barY, lines));
        }

        // Legend: rows of sample + words, in as many columns as the height needs.
        // Legend: rows of sample + words, in as many columns as the height needs; key notes (wrapped,
        // no sample) follow the samples as further rows.
        var notes = (content.KeyNotes ?? []).SelectMany(n => Wrap(n, Math.Min(availableWidth, 130), h)).ToArray();
        int rowCount = inUse.Count + notes.Length;
        if (rowCount > 0)
        {
            int rowsPerColumn = Math.Max(1, Math.Min(rowCount, (int)Math.Floor((availableHeight - h - descent) / pitch) + 1));
            var lines = new List<SheetLine>();
            double columnX = 0, width = 0;
            for (int i = 0; i < rowCount; i++)
            {
                int row = i % rowsPerColumn;
                if (row == 0 && i > 0) columnX = width + 3 * h;
                double baseline = h + row * pitch;
                if (i < inUse.Count)
                {
                    lines.AddRange(LegendSample(inUse[i], styles, new Vec2(columnX, baseline - h / 2)));
                    string words = LegendText(inUse[i], styles);
                    lines.AddRange(Text(words, new Vec2(columnX + LegendSampleMm + 2, baseline), h));
                    width = Math.Max(width, columnX + LegendSampleMm + 2 + StrokeFont.Measure(words, h));
                }
                else
                {
                    string note = notes[i - inUse.Count];
                    lines.AddRange(Text(note, new Vec2(columnX, baseline), h));
                    width = Math.Max(width, columnX + StrokeFont.Measure(note, h));
                }
            }
            int rows = Math.Min(rowsPerColumn, rowCount);
            blocks.Add(new Block("legend", width, h + (rows - 1) * pitch + descent, lines));
        }

        if (content.CautionLine)
        {
            double ch = 0.8 * h;
            blocks.Add(TextBlock("caution", Wrap(CautionLine, availableWidth, ch), ch));
        }

        // Cautions: wrapped to a comfortable reading width.
        if (content.IncludeCautions)
        {
            double ch = 0.8 * h;
            double measure = Math.Min(60 * ch, 160);
            var wrapped = CautionParagraphs.SelectMany(p => Wrap(p, measure, ch)).ToArray();
            blocks.Add(TextBlock("cautions", wrapped, ch));
        }
        return blocks;
    }

    internal static Block TextBlock(string name, IReadOnlyList<string> lines, double h)
    {
        string joined = string.Join("\n", lines);
        double descent = StrokeFont.DescenderUnits / StrokeFont.CapHeightUnits * h;
        return new Block(name, StrokeFont.Measure(joined, h), h + (lines.Count - 1) * StrokeFont.LineSpacing * h + descent,
            Text(joined, new Vec2(0, h), h).ToList());
    }

    internal static (List<SheetLine> Lines, List<string> Omitted, double UsedHeight) Flow(List<Block> blocks, SheetRegion region, double textHeight)
    {
        double gap = 3 * textHeight;
        double x = region.X, y = region.Y, shelf = 0, used = 0;
        var placed = new List<SheetLine>();
        var omitted = new List<string>();
        foreach (Block block in blocks)
        {
            if (block.Width > region.Width) { omitted.Add(block.Name); continue; }
            if (x > region.X && x + block.Width > region.Right)
            {
                x = region.X;
                y += shelf + gap;
                shelf = 0;
            }
            if (y + block.Height > region.Bottom) { omitted.Add(block.Name); continue; }
            var offset = new Vec2(x, y);
            placed.AddRange(block.Lines.Select(l => l with { Points = l.Points.Select(p => p + offset).ToArray() }));
            x += block.Width + gap;
            shelf = Math.Max(shelf, block.Height);
            used = Math.Max(used, y + block.Height - region.Y);
        }
        return (placed, omitted, used);
    }

    private static SheetLine Segment(Vec2 a, Vec2 b) => new(LineClass.Annotation, [a, b]);
}
