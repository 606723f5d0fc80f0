using Tessel.Core.Geometry;
using Tessel.Core.Sheets;

namespace Tessel.Tests.Sheets;

public class StrokeFontTests
{
    private const double Tol = 1e-9;

    private static (double MinX, double MinY, double MaxX, double MaxY) Bounds(Vec2[][] strokes)
    {
        var all = strokes.SelectMany(s => s).ToArray();
        return (all.Min(p => p.X), all.Min(p => p.Y), all.Max(p => p.X), all.Max(p => p.Y));
    }

    [Fact]
    public void The_brief_character_set_is_supported()
    {
        const string required = "ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789 .,:;-+/()#=%'\"!?<>_*\u00B0\u00D7";
        foreach (char c in required)
            Assert.True(StrokeFont.IsSupported(c), $"missing glyph for U+{(int)c:X4} '{c}'");
        Assert.True(StrokeFont.SupportedCharacters.Count >= required.Length);
    }

    [Fact]
    public void Every_supported_character_except_space_has_strokes_inside_its_cell()
    {
        foreach (char c in StrokeFont.SupportedCharacters)
        {
            // At 6 mm height one grid unit is 1 mm, so the numbers below are grid units.
            Vec2[][] strokes = StrokeFont.Layout(c.ToString(), Vec2.Zero, StrokeFont.CapHeightUnits);
            if (c == ' ') { Assert.Empty(strokes); continue; }
            Assert.NotEmpty(strokes);
            Assert.All(strokes, s => Assert.True(s.Length >= 2));
            double width = StrokeFont.Measure(c.ToString(), StrokeFont.CapHeightUnits);
            var b = Bounds(strokes);
            Assert.True(b.MinX >= -Tol && b.MaxX <= width + Tol, $"'{c}' spills sideways");
            // y down: baseline at 0, capitals up to -6, descenders to +1.5, brackets and the degree sign a little above.
            Assert.True(b.MinY >= -6.5 - Tol && b.MaxY <= StrokeFont.DescenderUnits + Tol, $"'{c}' spills vertically");
            Assert.True(b.MaxX - b.MinX + b.MaxY - b.MinY > 0.5, $"'{c}' is too small to see");
        }
    }

    [Fact]
    public void Glyphs_are_distinct_so_no_two_characters_read_alike()
    {
        var shapes = StrokeFont.SupportedCharacters
            .Select(c => string.Join(";", StrokeFont.Layout(c.ToString(), Vec2.Zero, 6)
                .Select(s => string.Join(" ", s.Select(p => $"{p.X:F2},{p.Y:F2}")))))
            .ToArray();
        Assert.Equal(shapes.Length, shapes.Distinct().Count());
    }

    [Fact]
    public void Measure_adds_advances_and_gaps_and_matches_the_laid_out_ink()
    {
        // H is 4 units wide, gap 1.5 units: at 6 mm height, "HH" = 4 + 1.5 + 4 = 9.5 mm.
        Assert.Equal(4.0, StrokeFont.Measure("H", 6), 9);
        Assert.Equal(9.5, StrokeFont.Measure("HH", 6), 9);
        Assert.Equal(19.0, StrokeFont.Measure("HH", 12), 9);
        Assert.Equal(0.0, StrokeFont.Measure("", 6), 9);
        // Letters that touch both sides of their cell: ink width equals the measured width.
        foreach (string s in new[] { "HELLO", "MIURA 42", "TAB A7-B3" })
        {
            var b = Bounds(StrokeFont.Layout(s, new Vec2(10, 20), 3.5));
            Assert.Equal(StrokeFont.Measure(s, 3.5), b.MaxX - b.MinX, 9);
            Assert.Equal(3.5, b.MaxY - b.MinY, 9);
            Assert.Equal(20.0, b.MaxY, 9);      // sits on the baseline
        }
        // Multi-line: the widest line wins.
        Assert.Equal(StrokeFont.Measure("WIDE ONE", 5), StrokeFont.Measure("AB\nWIDE ONE\nC", 5), 9);
    }

    [Fact]
    public void Lower_case_is_drawn_as_upper_case()
    {
        var lower = StrokeFont.Layout("valley fold 90\u00B0", new Vec2(1, 2), 4);
        var upper = StrokeFont.Layout("VALLEY FOLD 90\u00B0", new Vec2(1, 2), 4);
        Assert.Equal(upper.Length, lower.Length);
        for (int i = 0; i < upper.Length; i++)
            Assert.Equal(upper[i].Select(p => (p.X, p.Y)), lower[i].Select(p => (p.X, p.Y)));
    }

    [Fact]
    public void Accents_and_typographic_punctuation_fold_to_plain_glyphs()
    {
        static string Shape(string t) => string.Join(";", StrokeFont.Layout(t, Vec2.Zero, 5).Select(s => string.Join(" ", s.Select(p => $"{p.X:F3},{p.Y:F3}"))));
        Assert.Equal(Shape("CAFE - 'A' \"B\""), Shape("caf\u00E9 \u2013 \u2018\u00C0\u2019 \u201CB\u201D"));
        Assert.Equal(Shape("ZURICH"), Shape("Z\u00FCrich"));
        Assert.True(StrokeFont.IsSupported('\u00E9'));
    }

    [Fact]
    public void Unknown_characters_become_a_visible_box_not_a_crash()
    {
        Assert.False(StrokeFont.IsSupported('\u20AC'));
        Vec2[][] strokes = StrokeFont.Layout("\u20AC", Vec2.Zero, 6);
        Assert.NotEmpty(strokes);
        var b = Bounds(strokes);
        Assert.Equal((0.0, -6.0, 4.0, 0.0), (b.MinX, b.MinY, b.MaxX, b.MaxY));
        Assert.Equal(4.0, StrokeFont.Measure("\u20AC", 6), 9);
        // A crossed box: the outline-with-diagonal stroke plus the second diagonal, so it cannot be
        // mistaken for the slashed zero (an octagon with one slash).
        Assert.Equal(2, strokes.Length);
        Assert.Equal((0.0, 0.0, 4.0, -6.0), (strokes[1].Min(p => p.X), strokes[1].Max(p => p.Y), strokes[1].Max(p => p.X), strokes[1].Min(p => p.Y)));
        Assert.NotEmpty(StrokeFont.Layout("\u4E2D\uD83D\uDE00\t", Vec2.Zero, 3));
    }

    [Theory]
    [InlineData(TextAnchor.BaselineLeft, 0.0, 0.0)]
    [InlineData(TextAnchor.BaselineCentre, -0.5, 0.0)]
    [InlineData(TextAnchor.BaselineRight, -1.0, 0.0)]
    [InlineData(TextAnchor.TopLeft, 0.0, 1.0)]
    [InlineData(TextAnchor.MiddleCentre, -0.5, 0.5)]
    [InlineData(TextAnchor.TopRight, -1.0, 1.0)]
    public void Anchor_places_the_named_point_on_the_origin(TextAnchor anchor, double xShare, double yShare)
    {
        var origin = new Vec2(50, 80);
        const string text = "NUMBER 17";
        double h = 5, w = StrokeFont.Measure(text, h);
        var b = Bounds(StrokeFont.Layout(text, origin, h, 0, anchor));
        Assert.Equal(origin.X + xShare * w, b.MinX, 9);
        // Capitals span from the cap line (y - h) to the baseline (y), y down.
        Assert.Equal(origin.Y + yShare * h, b.MaxY, 9);
        Assert.Equal(origin.Y + yShare * h - h, b.MinY, 9);
    }

    [Fact]
    public void A_quarter_turn_reads_bottom_to_top()
    {
        // Counter-clockwise as seen on the sheet: with y down the text runs towards smaller y,
        // and the letters' tops point towards smaller x.
        var b = Bounds(StrokeFont.Layout("HH", new Vec2(100, 100), 6, Math.PI / 2));
        Assert.Equal(100 - 9.5, b.MinY, 9);
        Assert.Equal(100, b.MaxY, 9);
        Assert.Equal(94, b.MinX, 9);
        Assert.Equal(100, b.MaxX, 9);
    }

    [Fact]
    public void Second_line_sits_one_line_spacing_lower()
    {
        var one = Bounds(StrokeFont.Layout("E", Vec2.Zero, 4));
        var two = Bounds(StrokeFont.Layout("E\nE", Vec2.Zero, 4));
        Assert.Equal(one.MaxY + StrokeFont.LineSpacing * 4, two.MaxY, 9);
        Assert.Equal(one.MinY, two.MinY, 9);
    }

    [Fact]
    public void Non_positive_height_is_rejected()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => StrokeFont.Layout("A", Vec2.Zero, 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => StrokeFont.Layout("A", Vec2.Zero, double.NaN));
    }
}
