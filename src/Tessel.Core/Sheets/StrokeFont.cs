using System.Globalization;
using Tessel.Core.Geometry;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>A small single-stroke vector font of our own design. Text becomes plain polylines in
/// sheet millimetres, so every writer (SVG, DXF, PDF, PNG) draws identical letters and a laser can
/// score or engrave them like any other line; no font files are needed at run time.</summary>
/// <remarks>
/// Glyphs sit on a grid whose capitals are <see cref="CapHeightUnits"/> units tall; the text height
/// passed in is the capital height in millimetres. Lower-case letters are drawn as capitals, accented
/// Latin letters as their base letter, typographic quotes and dashes as plain ones.
/// A character the font does not know is drawn as a crossed box, never dropped and never
/// an exception, so a missing glyph shows on the proof instead of silently changing a label.
/// Lines of text are separated by '\n' and stacked downwards <see cref="LineSpacing"/> heights apart.
/// </remarks>
public static class StrokeFont
{
    /// <summary>Capital height in grid units; the scale factor is heightMm / this.</summary>
    public const double CapHeightUnits = 6.0;

    /// <summary>Gap between neighbouring glyphs, in grid units.</summary>
    public const double LetterGapUnits = 1.5;

    /// <summary>Distance between the baselines of two text lines, in multiples of the capital height.</summary>
    public const double LineSpacing = 1.7;

    /// <summary>Lowest point of any glyph (comma, underscore, brackets), in grid units below the
    /// baseline; callers reserve this much room under a text line.</summary>
    public const double DescenderUnits = 1.5;

    private readonly record struct Glyph(double Width, Vec2[][] Strokes);

    private static readonly Dictionary<char, Glyph> Glyphs =
        StrokeFontGlyphs.Sources.ToDictionary(kv => kv.Key, kv => Parse(kv.Value));

    private static readonly Glyph UnknownGlyph = Parse(StrokeFontGlyphs.Unknown);

    /// <summary>Every character with its own glyph (upper case, digits, punctuation, degree sign,
    /// multiplication sign), in ordinal order.</summary>
    public static IReadOnlyList<char> SupportedCharacters { get; } =
        Glyphs.Keys.OrderBy(c => c).ToArray();

    /// <summary>True when <paramref name="c"/> (after mapping lower case to upper case) has its own
    /// glyph rather than the unknown-character box.</summary>
    public static bool IsSupported(char c) => Glyphs.ContainsKey(Normalise(c));

    /// <summary>Width in millimetres of the widest line of <paramref name="text"/> at capital height
    /// <paramref name="heightMm"/>: the sum of glyph advances and the gaps between them (no trailing gap).</summary>
    public static double Measure(string text, double heightMm)
    {
        ArgumentNullException.ThrowIfNull(text);
        double widest = 0;
        foreach (string line in text.Split('\n'))
            widest = Math.Max(widest, MeasureLineUnits(line));
        return widest * heightMm / CapHeightUnits;
    }

    /// <summary>Lays out <paramref name="text"/> as polylines in sheet millimetres (y down).</summary>
    /// <param name="text">The text; '\n' starts a new line, '\r' is ignored.</param>
    /// <param name="origin">Where the <paramref name="anchor"/> point of the first line goes, in sheet mm.</param>
    /// <param name="heightMm">Capital height in millimetres (must be positive).</param>
    /// <param name="angleRadians">Baseline direction, counter-clockwise as seen on the sheet
    /// (so 0 reads left to right, pi/2 reads bottom to top).</param>
    /// <param name="anchor">Which point of each line sits on the origin (horizontal part) and of
    /// the first line (vertical part).</param>
    /// <returns>One array of points per stroke, each with at least two points.</returns>
    public static Vec2[][] Layout(string text, Vec2 origin, double heightMm, double angleRadians = 0,
        TextAnchor anchor = TextAnchor.BaselineLeft)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (!(heightMm > 0) || double.IsInfinity(heightMm))
            throw new ArgumentOutOfRangeException(nameof(heightMm), heightMm, "Text height must be a positive number of millimetres.");

        double scale = heightMm / CapHeightUnits;
        // Sheet y points down, so "along the text" and "up the letters" are the visual
        // counter-clockwise frame with its y component negated.
        var along = new Vec2(Math.Cos(angleRadians), -Math.Sin(angleRadians));
        var up = new Vec2(-Math.Sin(angleRadians), -Math.Cos(angleRadians));

        double lift = anchor switch
        {
            TextAnchor.TopLeft or TextAnchor.TopCentre or TextAnchor.TopRight => -CapHeightUnits,
            TextAnchor.MiddleLeft or TextAnchor.MiddleCentre or TextAnchor.MiddleRight => -CapHeightUnits / 2,
            _ => 0,
        };
        double alignment = anchor switch
        {
            TextAnchor.BaselineCentre or TextAnchor.TopCentre or TextAnchor.MiddleCentre => 0.5,
            TextAnchor.BaselineRight or TextAnchor.TopRight or TextAnchor.MiddleRight => 1.0,
            _ => 0.0,
        };

        var strokes = new List<Vec2[]>();
        string[] lines = text.Split('\n');
        for (int lineIndex = 0; lineIndex < lines.Length; lineIndex++)
        {
            string line = lines[lineIndex];
            double x = -alignment * MeasureLineUnits(line);
            double y = lift - lineIndex * LineSpacing * CapHeightUnits;
            foreach (char c in line)
            {
                if (c == '\r') continue;
                Glyph glyph = GlyphFor(c);
                foreach (Vec2[] stroke in glyph.Strokes)
                {
                    var placed = new Vec2[stroke.Length];
                    for (int i = 0; i < stroke.Length; i++)
                    {
                        double u = (x + stroke[i].X) * scale, v = (y + stroke[i].Y) * scale;
                        placed[i] = origin + u * along + v * up;
                    }
                    strokes.Add(placed);
                }
                x += glyph.Width + LetterGapUnits;
            }
        }
        return strokes.ToArray();
    }

    private static double MeasureLineUnits(string line)
    {
        double width = 0;
        int count = 0;
        foreach (char c in line)
        {
            if (c == '\r') continue;
            width += GlyphFor(c).Width;
            count++;
        }
        return count == 0 ? 0 : width + (count - 1) * LetterGapUnits;
    }

    /// <summary>Upper case first (so accented lower-case letters reach the fold table), then the fold.</summary>
    private static char Normalise(char c)
    {
        char upper = char.ToUpperInvariant(c);
        return StrokeFontGlyphs.Folds.TryGetValue(upper, out char folded) ? folded : upper;
    }

    private static Glyph GlyphFor(char c) =>
        Glyphs.TryGetValue(Normalise(c), out Glyph g) ? g : UnknownGlyph;

    private static Glyph Parse(StrokeFontGlyphs.GlyphSource source)
    {
        if (source.Strokes.Length == 0) return new Glyph(source.Width, []);
        Vec2[][] strokes = source.Strokes.Split('|')
            .Select(stroke => stroke.Split(' ', StringSplitOptions.RemoveEmptyEntries)
                .Select(pair =>
                {
                    string[] xy = pair.Split(',');
                    return new Vec2(double.Parse(xy[0], CultureInfo.InvariantCulture),
                                    double.Parse(xy[1], CultureInfo.InvariantCulture));
                })
                .ToArray())
            .ToArray();
        return new Glyph(source.Width, strokes);
    }
}
