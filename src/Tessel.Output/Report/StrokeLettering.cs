using SkiaSharp;

namespace Tessel.Output.Report;

/// <summary>Single-stroke capitals, digits and a few signs drawn as lines: the previews' fallback when no
/// typeface with glyphs is installed, so labels never silently vanish. Lower case is drawn as capitals;
/// a character without a glyph is drawn as an open box.</summary>
/// <remarks>Glyphs sit on a grid 4 units wide and 6 high (y down from the cap line to the baseline);
/// one unit is 0.12 of the font size, so the cap height matches a typical typeface's.</remarks>
public static class StrokeLettering
{
    private const string Box = "0,0 4,0 4,6 0,6 0,0";

    // Polylines separated by '|', points "x,y" separated by spaces. Drawn for this project.
    private static readonly Dictionary<char, string> Glyphs = new()
    {
        ['0'] = "0,0 4,0 4,6 0,6 0,0|0,6 4,0", ['1'] = "1,1 2,0 2,6|1,6 3,6", ['2'] = "0,1 1,0 3,0 4,1 4,2 0,6 4,6",
        ['3'] = "0,0 4,0 2,2 3,2 4,3 4,5 3,6 1,6 0,5", ['4'] = "3,6 3,0 0,4 4,4", ['5'] = "4,0 0,0 0,2 3,2 4,3 4,5 3,6 0,6",
        ['6'] = "4,0 1,0 0,1 0,5 1,6 3,6 4,5 4,4 3,3 0,3", ['7'] = "0,0 4,0 1,6",
        ['8'] = "1,0 3,0 4,1 4,2 3,3 1,3 0,2 0,1 1,0|1,3 0,4 0,5 1,6 3,6 4,5 4,4 3,3", ['9'] = "4,3 1,3 0,2 0,1 1,0 3,0 4,1 4,5 3,6 0,6",
        ['A'] = "0,6 0,2 2,0 4,2 4,6|0,4 4,4", ['B'] = "0,0 0,6 3,6 4,5 4,4 3,3 0,3|0,0 3,0 4,1 4,2 3,3", ['C'] = "4,0 1,0 0,1 0,5 1,6 4,6",
        ['D'] = "0,0 0,6 3,6 4,5 4,1 3,0 0,0", ['E'] = "4,0 0,0 0,6 4,6|0,3 3,3", ['F'] = "4,0 0,0 0,6|0,3 3,3",
        ['G'] = "4,1 3,0 1,0 0,1 0,5 1,6 3,6 4,5 4,3 2,3", ['H'] = "0,0 0,6|4,0 4,6|0,3 4,3", ['I'] = "1,0 3,0|2,0 2,6|1,6 3,6",
        ['J'] = "4,0 4,5 3,6 1,6 0,5", ['K'] = "0,0 0,6|4,0 0,4|1,3 4,6", ['L'] = "0,0 0,6 4,6", ['M'] = "0,6 0,0 2,3 4,0 4,6",
        ['N'] = "0,6 0,0 4,6 4,0", ['O'] = "1,0 3,0 4,1 4,5 3,6 1,6 0,5 0,1 1,0", ['P'] = "0,6 0,0 3,0 4,1 4,2 3,3 0,3",
        ['Q'] = "1,0 3,0 4,1 4,5 3,6 1,6 0,5 0,1 1,0|2,4 4,6", ['R'] = "0,6 0,0 3,0 4,1 4,2 3,3 0,3|2,3 4,6",
        ['S'] = "4,1 3,0 1,0 0,1 0,2 1,3 3,3 4,4 4,5 3,6 1,6 0,5", ['T'] = "0,0 4,0|2,0 2,6", ['U'] = "0,0 0,5 1,6 3,6 4,5 4,0",
        ['V'] = "0,0 2,6 4,0", ['W'] = "0,0 1,6 2,3 3,6 4,0", ['X'] = "0,0 4,6|4,0 0,6", ['Y'] = "0,0 2,3 4,0|2,3 2,6",
        ['Z'] = "0,0 4,0 0,6 4,6",
        ['+'] = "0,3 4,3|2,1 2,5", ['-'] = "1,3 3,3", ['.'] = "1.6,5.6 2.4,5.6 2.4,6 1.6,6 1.6,5.6", [','] = "2,5 1,7",
        [':'] = "1.6,1.6 2.4,1.6 2.4,2 1.6,2 1.6,1.6|1.6,5.6 2.4,5.6 2.4,6 1.6,6 1.6,5.6", [';'] = "2,1.6 2,2|2,5 1,7",
        ['('] = "3,0 2,1 2,5 3,6", [')'] = "1,0 2,1 2,5 1,6", ['/'] = "0,6 4,0", ['='] = "0,2 4,2|0,4 4,4", ['|'] = "2,0 2,6",
        ['%'] = "0,6 4,0|0,0 1,0 1,1 0,1 0,0|3,5 4,5 4,6 3,6 3,5", ['!'] = "2,0 2,4|2,5.6 2,6", ['?'] = "0,1 1,0 3,0 4,1 4,2 2,3 2,4|2,5.6 2,6",
        ['\u03b5'] = "4,2 1,2 0,3 1,4 0,5 1,6 4,6|1,4 3,4", ['\u2014'] = "0,3 4,3",
    };

    /// <summary>Grid units per font size unit.</summary>
    private const float Unit = 0.12f;

    /// <summary>Width of a text in pixels at a font size: 6 units per character (4 drawn, 2 space).</summary>
    public static float Measure(string text, float size) => text.Length * 6 * Unit * size;

    /// <summary>Whether a character has its own glyph (otherwise it is drawn as a box; spaces are blank).</summary>
    public static bool HasGlyph(char c) => c == ' ' || Lookup(c) != null;

    // The character itself first (so Greek small epsilon keeps its own shape), then its capital.
    private static string? Lookup(char c) =>
        Glyphs.TryGetValue(c, out var g) ? g : Glyphs.TryGetValue(char.ToUpperInvariant(c), out var u) ? u : null;

    /// <summary>Draws text with its baseline at y, aligned on x like <see cref="SKTextAlign"/>.</summary>
    public static void Draw(SKCanvas canvas, string text, float x, float y, float size, SKColor colour, SKTextAlign align = SKTextAlign.Left)
    {
        float u = Unit * size;
        float width = Measure(text, size);
        float left = align switch { SKTextAlign.Center => x - width / 2, SKTextAlign.Right => x - width, _ => x } + u;
        float top = y - 6 * u;
        using var pen = new SKPaint
        {
            Color = colour, IsStroke = true, IsAntialias = true, StrokeWidth = Math.Max(1f, 0.085f * size),
            StrokeCap = SKStrokeCap.Round, StrokeJoin = SKStrokeJoin.Round,
        };
        for (int i = 0; i < text.Length; i++)
        {
            if (text[i] == ' ') continue;
            string strokes = Lookup(text[i]) ?? Box;
            float ox = left + i * 6 * u;
            foreach (var line in strokes.Split('|'))
            {
                var pts = line.Split(' ').Select(p =>
                {
                    var xy = p.Split(',');
                    return new SKPoint(ox + u * float.Parse(xy[0], System.Globalization.CultureInfo.InvariantCulture),
                        top + u * float.Parse(xy[1], System.Globalization.CultureInfo.InvariantCulture));
                }).ToArray();
                canvas.DrawPoints(SKPointMode.Polygon, pts, pen);
            }
        }
    }
}
