using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class AnnotationSheetTests
{
    private static readonly AnnotationContent Content = new("Pavilion study", 3, "1:50");

    private static Sheet PartsInTopHalf() => new(1, 210, 297,
    [
        new SheetLine(LineClass.CutOutline, [new(20, 20), new(190, 20), new(190, 140), new(20, 140)], Closed: true),
        new SheetLine(LineClass.Valley, [new(20, 80), new(190, 80)]),
        new SheetLine(LineClass.Mountain, [new(105, 20), new(105, 140)]),
    ]);

    [Fact]
    public void Scale_bar_is_100_mm_with_eleven_ticks()
    {
        SheetLine[] bar = SheetAnnotations.ScaleBar(new Vec2(10, 50), 2.5);
        SheetLine main = bar[0];
        // Compared as tuples: Vec2.ToString recurses forever through its Perp property, so a failing
        // Assert.Equal on Vec2 values would crash the test host instead of reporting.
        Assert.Equal((10.0, 50.0), (main.Points[0].X, main.Points[0].Y));
        Assert.Equal((110.0, 50.0), (main.Points[1].X, main.Points[1].Y));
        var ticks = bar.Skip(1).Take(11).ToArray();
        Assert.Equal(Enumerable.Range(0, 11).Select(i => 10.0 + 10 * i), ticks.Select(t => t.Points[0].X));
        Assert.All(ticks, t => Assert.Equal(t.Points[0].X, t.Points[1].X));
        Assert.All(bar, l => Assert.Equal(LineClass.Annotation, l.Class));
    }

    [Fact]
    public void Check_square_is_10_mm_and_closed()
    {
        SheetLine sq = SheetAnnotations.CheckSquare(new Vec2(5, 7));
        Assert.True(sq.Closed);
        Assert.Equal(10.0, sq.Points.Max(p => p.X) - sq.Points.Min(p => p.X), 12);
        Assert.Equal(10.0, sq.Points.Max(p => p.Y) - sq.Points.Min(p => p.Y), 12);
    }

    [Fact]
    public void Legend_samples_copy_the_dash_pattern_but_are_never_cut()
    {
        // Valley: 3 mm dashes, 0.75 mm gaps over 15 mm: dashes start at 0, 3.75, 7.5, 11.25.
        SheetLine[] valley = SheetAnnotations.LegendSample(LineClass.Valley, LineStyleTable.Default, new Vec2(0, 0));
        Assert.Equal(new[] { 0, 3.75, 7.5, 11.25 }, valley.Select(s => Math.Round(s.Points[0].X, 9)));
        Assert.Equal(14.25, valley[^1].Points[1].X, 9);
        Assert.All(valley, s => Assert.Equal(LineClass.Annotation, s.Class));
        Assert.Single(SheetAnnotations.LegendSample(LineClass.CutOutline, LineStyleTable.Default, Vec2.Zero));
        Assert.Contains("TS-CREASE-VLY", SheetAnnotations.LegendText(LineClass.Valley, LineStyleTable.Default));
        Assert.Contains("SCORE", SheetAnnotations.LegendText(LineClass.Valley, LineStyleTable.Default));
    }

    [Fact]
    public void Strip_holds_everything_inside_it_and_leaves_the_parts_alone()
    {
        Sheet sheet = PartsInTopHalf();
        double needed = SheetAnnotations.RequiredStripHeight(190, Content, LineStyleTable.Default, sheet.Lines.Select(l => l.Class));
        Assert.InRange(needed, 20, 140);
        var strip = new SheetRegion(10, 287 - needed, 190, needed);
        AnnotationPlacement placed = SheetAnnotations.AddToStrip(sheet, strip, Content, LineStyleTable.Default);
        Assert.Empty(placed.Omitted);
        Assert.Equal(sheet.Lines, placed.Sheet.Lines.Take(sheet.Lines.Length)); // parts untouched, in order
        SheetLine[] added = placed.Sheet.Lines.Skip(sheet.Lines.Length).ToArray();
        Assert.All(added, l => Assert.Equal(LineClass.Annotation, l.Class));
        Assert.All(added.SelectMany(l => l.Points), p => Assert.True(strip.Contains(p, 1e-6), $"({p.X}, {p.Y}) outside the strip"));
        Assert.True(placed.UsedHeightMm <= needed + 1e-9);
        // Title, scale bar and square are all there: the square is the only closed 10 x 10 annotation.
        Assert.Single(added, l => l.Closed && Math.Abs(l.Points.Max(p => p.X) - l.Points.Min(p => p.X) - 10) < 1e-9);
        Assert.Single(added, l => l.Points.Length == 2 && Math.Abs(l.Points[1].X - l.Points[0].X - 100) < 1e-9);
    }

    [Fact]
    public void Legend_lists_only_the_classes_in_use()
    {
        Sheet sheet = PartsInTopHalf();
        var strip = new SheetRegion(10, 150, 190, 137);
        var with = SheetAnnotations.AddToStrip(sheet, strip, Content with { IncludeCautions = false }, LineStyleTable.Default).Sheet;
        int legendRows(Sheet s) => s.Lines.Count(l => l.Class == LineClass.Annotation);
        var moreClasses = sheet with { Lines = [.. sheet.Lines, new SheetLine(LineClass.TabFold, [new(20, 100), new(40, 100)])] };
        var withTab = SheetAnnotations.AddToStrip(moreClasses, strip, Content with { IncludeCautions = false }, LineStyleTable.Default).Sheet;
        Assert.True(legendRows(withTab) > legendRows(with)); // one more legend row
    }

    [Fact]
    public void A_strip_too_small_reports_what_it_left_out()
    {
        var strip = new SheetRegion(10, 250, 60, 37);
        AnnotationPlacement placed = SheetAnnotations.AddToStrip(PartsInTopHalf(), strip, Content, LineStyleTable.Default);
        Assert.Contains("print check", placed.Omitted); // 100 mm bar cannot fit in 60 mm
        Assert.All(placed.Sheet.Lines.Where(l => l.Class == LineClass.Annotation).SelectMany(l => l.Points),
            p => Assert.True(strip.Contains(p, 1e-6)));
    }

    [Fact]
    public void A_strip_over_the_parts_is_refused()
    {
        var overParts = new SheetRegion(10, 100, 190, 60); // the part spans y 20..140
        Assert.Throws<InvalidOperationException>(() => SheetAnnotations.AddToStrip(PartsInTopHalf(), overParts, Content, LineStyleTable.Default));
        // A segment crossing the strip without a vertex inside it is caught too.
        var crossing = new Sheet(1, 210, 297, [new SheetLine(LineClass.Valley, [new(50, 0), new(50, 297)])]);
        Assert.Throws<InvalidOperationException>(() => SheetAnnotations.AddToStrip(crossing, new SheetRegion(10, 200, 190, 80), Content, LineStyleTable.Default));
    }

    [Fact]
    public void An_empty_strip_is_refused()
    {
        Assert.Throws<ArgumentException>(() => SheetAnnotations.AddToStrip(PartsInTopHalf(), new SheetRegion(10, 200, 190, 0), Content, LineStyleTable.Default));
    }

    [Fact]
    public void Legend_words_follow_an_edited_cut_score_mapping()
    {
        LineStyleTable shop = LineStyleTable.Default.WithOperation(LineClass.Valley, LineOperation.Cut);
        Assert.Contains("CUT THROUGH", SheetAnnotations.LegendText(LineClass.Valley, shop).ToUpperInvariant());
        Assert.DoesNotContain("SCORE", SheetAnnotations.LegendText(LineClass.Valley, shop).ToUpperInvariant());
    }

    [Fact]
    public void Cover_sheet_carries_all_blocks_and_the_cautions()
    {
        AnnotationPlacement cover = SheetAnnotations.CoverSheet(0, 297, 210, 10, Content, LineStyleTable.Default,
            [LineClass.CutOutline, LineClass.Valley, LineClass.Mountain]);
        Assert.Empty(cover.Omitted);
        Assert.NotEmpty(cover.Sheet.Lines);
        Assert.All(cover.Sheet.Lines, l => Assert.Equal(LineClass.Annotation, l.Class));
        // The caution wording covers what the brief requires.
        string all = string.Join(" ", SheetAnnotations.CautionParagraphs).ToUpperInvariant();
        foreach (string must in new[] { "UNATTENDED", "EXTRACTION", "CO2 EXTINGUISHER", "PVC", "VINYL", "HYDROGEN CHLORIDE",
                     "CHLORINE", "PTFE", "POLYCARBONATE", "ABS", "BLADE", "STRUCTURAL", "LICENSED ENGINEER", "LOCAL CODES" })
            Assert.Contains(must, all);
        Assert.All(all, c => Assert.True(StrokeFont.IsSupported(c), $"caution uses unsupported '{c}'"));
    }

    [Fact]
    public void Wrap_keeps_lines_within_the_measure()
    {
        var lines = SheetAnnotations.Wrap(SheetAnnotations.CautionParagraphs[1], 80, 2);
        Assert.True(lines.Count > 1);
        Assert.All(lines, l => Assert.True(StrokeFont.Measure(l, 2) <= 80 + 1e-9));
        Assert.Equal(SheetAnnotations.CautionParagraphs[1], string.Join(" ", lines));
    }
}
