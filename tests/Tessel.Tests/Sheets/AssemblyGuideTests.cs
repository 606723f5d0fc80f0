using Tessel.Core.Geometry;
using Tessel.Core.Jobs;
using Tessel.Core.Model;
using Tessel.Core.Pipeline;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

/// <summary>Sheet numbering, the notes that tie a front job to its back job, the one-line caution on
/// every part sheet, and the cover as an assembly guide.</summary>
public class AssemblyGuideTests
{
    // An invented job: a 6 x 6 cell Miura sheet (1 m cells) at 1:20 on A4 card, so the pattern is split
    // over several sheets and card's valleys are scored from the back (two jobs per sheet).
    private static readonly Job Card = JobLoader.Parse("""
        { "name": "quarry-hut", "target": { "kind": "plane", "footprint": { "width": 4, "depth": 3 } },
          "fabrication": { "scale": 20, "material": "card", "sheet": { "name": "A4" } } }
        """, "quarry-hut.json", Path.GetTempPath());

    private static readonly Lazy<SheetStageResult> Result = new(() => SheetStage.Run(Card, FlatMiura.Build(6, 6), ProgressReporter.Silent));

    [Fact]
    public void SheetsAreNumberedOneToNWithTheBackJobFirst()
    {
        var sheets = Result.Value.Sheets;
        int n = sheets.Select(s => s.Number).Distinct().Count();
        Assert.True(n >= 2, $"the test job should need several sheets, got {n}");
        Assert.Equal(Enumerable.Range(1, n), sheets.Select(s => s.Number).Distinct());
        Assert.Equal(2 * n, sheets.Count);
        for (int i = 0; i < n; i++)
        {
            Assert.Equal((i + 1, "back"), (sheets[2 * i].Number, sheets[2 * i].Side));
            Assert.Equal((i + 1, "front"), (sheets[2 * i + 1].Number, sheets[2 * i + 1].Side));
        }
    }

    [Fact]
    public void FrontAndBackJobsNameEachOther()
    {
        var r = Result.Value;
        var front = r.Sheets.First(s => s.Side == "front" && s.Number == 2);
        var back = r.Sheets.First(s => s.Side == "back" && s.Number == 2);
        string[] types = [".svg", ".dxf", ".png"];
        string frontNote = Assert.Single(SheetStage.PairNotes(front, r.Settings, types));
        Assert.Equal("BACK JOB: valley folds are in sheet-02-back (.svg .dxf .png), run first; this front job shows only the rest. See the cover.", frontNote);
        string backNote = Assert.Single(SheetStage.PairNotes(back, r.Settings, types));
        Assert.Contains("BACK JOB of sheet-02: run first, then turn the sheet over left to right", backNote);
        Assert.All(frontNote + backNote, c => Assert.True(StrokeFont.IsSupported(c), $"note uses unsupported '{c}'"));
    }

    private static int Strokes(string text, double width, double h) =>
        SheetAnnotations.Wrap(text, width, h).Sum(line => SheetAnnotations.Text(line, Vec2.Zero, h).Length);

    [Fact]
    public void EveryPartSheetCarriesTheNotesAndTheCautionLine()
    {
        var r = Result.Value;
        var settings = r.Settings;
        var strip = settings.AnnotationStrip;
        int sheetCount = r.Sheets.Select(s => s.Number).Distinct().Count();
        string[] types = SheetStage.FileTypes(Card);
        foreach (var annotated in r.Sheets)
        {
            var raw = r.Layout.Sheets.Single(s => s.Number == annotated.Number && s.Side == annotated.Side);
            var bare = new AnnotationContent(Card.Name, sheetCount, "1:20", IncludeCautions: false);
            var full = bare with { CautionLine = true, KeyNotes = SheetStage.PairNotes(raw, settings, types) };
            var placed = SheetAnnotations.AddToStrip(raw, strip, full, r.Styles);
            Assert.Empty(placed.Omitted);
            Assert.Equal(placed.Sheet.Lines.Length, annotated.Lines.Length);
            // What the caution and the note add is exactly their wrapped text, stroke for stroke.
            int without = SheetAnnotations.AddToStrip(raw, strip, bare, r.Styles).Sheet.Lines.Length;
            double h = bare.TextHeightMm;
            int expected = Strokes(SheetAnnotations.CautionLine, strip.Width, 0.8 * h) + Strokes(full.KeyNotes![0], Math.Min(strip.Width, 130), h);
            Assert.Equal(expected, annotated.Lines.Length - without);
        }
    }

    [Fact]
    public void CoverListsEverySheetFileInCuttingOrder()
    {
        var r = Result.Value;
        string order = AssemblyGuide.CuttingOrder(r.Layout.Sheets, [".svg", ".dxf"]);
        int at = -1;
        for (int i = 0; i < r.Sheets.Count; i++)
        {
            string entry = $"{i + 1}. {SheetFiles.BaseName(r.Sheets[i])} (.svg .dxf)";
            int next = order.IndexOf(entry, StringComparison.Ordinal);
            Assert.True(next > at, $"'{entry}' missing or out of order in: {order}");
            at = next;
        }
        Assert.StartsWith("1. sheet-01-back (.svg .dxf) - back job, mirrored; 2. sheet-01 (.svg .dxf); 3. sheet-02-back", order);
    }

    [Fact]
    public void CoverFitsEveryBlockInsideItsMargins()
    {
        var r = Result.Value;
        var s = r.Settings;
        var content = new AnnotationContent(Card.Name, 3, "1:20");
        foreach (var (w, hgt) in new[] { (s.Sheet.WidthMm, s.Sheet.HeightMm), (420.0, 297.0), (210.0, 297.0) })
        {
            var cover = AssemblyGuide.Cover(w, hgt, s.MarginMm, content, r.Styles, r.Layout, FlatMiura.Build(6, 6), [".svg"]);
            Assert.Empty(cover.Omitted);
            Assert.Equal("cover", cover.Sheet.Side);
            Assert.All(cover.Sheet.Lines, l => Assert.Equal(LineClass.Annotation, l.Class));
            // Brackets and quotes of the stroke font reach a little above the cap line the blocks are
            // measured by: allow half a millimetre.
            const double slack = 0.5;
            foreach (var p in cover.Sheet.Lines.SelectMany(l => l.Points))
                Assert.True(p.X >= s.MarginMm - slack && p.X <= w - s.MarginMm + slack && p.Y >= s.MarginMm - slack && p.Y <= hgt - s.MarginMm + slack,
                    $"({p.X:0.##}, {p.Y:0.##}) outside the margins of a {w} x {hgt} cover");
        }
    }

    [Fact]
    public void KeyPlanDrawsEveryPartBoundaryOnce()
    {
        // Independent count: edges of the flat pattern whose two sides lie in different parts, plus the
        // pattern's boundary edges. The key plan draws these as two-point segments and nothing else
        // outside its text, and text strokes are never plain straight two-point lines longer than the
        // caption's capitals (so count only segments longer than 5 mm on a large plan).
        var r = Result.Value;
        var flat = FlatMiura.Build(6, 6);
        var partOf = new int[flat.Folded.FaceCount];
        foreach (var part in r.Layout.Parts) foreach (int f in part.Faces) partOf[f] = part.Number;
        int expected = 0;
        for (int e = 0; e < flat.EdgeCount; e++)
        {
            int l = flat.Folded.EdgeFaceLeft[e], rt = flat.Folded.EdgeFaceRight[e];
            if (l < 0 || rt < 0 || partOf[l] != partOf[rt]) expected++;
        }
        var plan = AssemblyGuide.KeyPlan(new SheetRegion(0, 0, 800, 800), r.Layout, flat, 2.5);
        int drawn = plan.Count(l => l.Points.Length == 2 && (l.Points[1] - l.Points[0]).Length > 5);
        Assert.Equal(expected, drawn);
        Assert.True(r.Layout.Parts.Length >= 2);
    }
}
