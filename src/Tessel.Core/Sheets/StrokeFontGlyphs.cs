namespace Tessel.Core.Sheets;

/// <summary>The glyph outlines of <see cref="StrokeFont"/>: our own single-stroke design on a grid
/// whose capitals are 6 units tall and (mostly) 4 units wide, y up from the baseline, descenders
/// down to -1.5.</summary>
/// <remarks>Each glyph is written as strokes separated by '|', each stroke a list of "x,y" grid
/// points joined in order. The advance width is given separately so punctuation can be narrow.
/// Dots are drawn as tiny closed squares rather than zero-length strokes so that a laser or a pen
/// actually marks them.</remarks>
internal static class StrokeFontGlyphs
{
    /// <summary>One glyph's source: its advance width in grid units and its strokes.</summary>
    internal readonly record struct GlyphSource(double Width, string Strokes);

    private const string DotAtBase = "0,0 0.6,0 0.6,0.6 0,0.6 0,0";

    /// <summary>All supported characters (lower case is mapped to upper case before lookup).</summary>
    internal static readonly IReadOnlyDictionary<char, GlyphSource> Sources = new Dictionary<char, GlyphSource>
    {
        ['A'] = new(4, "0,0 2,6 4,0|0.7,2 3.3,2"),
        ['B'] = new(4, "0,3 3,3 4,4 4,5 3,6 0,6 0,0 3,0 4,1 4,2 3,3"),
        ['C'] = new(4, "4,5 3,6 1,6 0,5 0,1 1,0 3,0 4,1"),
        ['D'] = new(4, "0,0 0,6 2.5,6 4,4.5 4,1.5 2.5,0 0,0"),
        ['E'] = new(4, "4,6 0,6 0,0 4,0|0,3 3,3"),
        ['F'] = new(4, "4,6 0,6 0,0|0,3 3,3"),
        ['G'] = new(4, "4,5 3,6 1,6 0,5 0,1 1,0 3,0 4,1 4,3 2,3"),
        ['H'] = new(4, "0,0 0,6|4,0 4,6|0,3 4,3"),
        ['I'] = new(4, "1,6 3,6|2,6 2,0|1,0 3,0"),
        ['J'] = new(4, "4,6 4,1 3,0 1,0 0,1"),
        ['K'] = new(4, "0,0 0,6|4,6 0,2|1.3,3.3 4,0"),
        ['L'] = new(4, "0,6 0,0 4,0"),
        ['M'] = new(4, "0,0 0,6 2,3 4,6 4,0"),
        ['N'] = new(4, "0,0 0,6 4,0 4,6"),
        ['O'] = new(4, "1,0 0,1 0,5 1,6 3,6 4,5 4,1 3,0 1,0"),
        ['P'] = new(4, "0,0 0,6 3,6 4,5 4,4 3,3 0,3"),
        ['Q'] = new(4, "1,0 0,1 0,5 1,6 3,6 4,5 4,1 3,0 1,0|2.5,1.5 4,0"),
        ['R'] = new(4, "0,0 0,6 3,6 4,5 4,4 3,3 0,3|2,3 4,0"),
        ['S'] = new(4, "4,5 3,6 1,6 0,5 0,4 1,3 3,3 4,2 4,1 3,0 1,0 0,1"),
        ['T'] = new(4, "0,6 4,6|2,6 2,0"),
        ['U'] = new(4, "0,6 0,1 1,0 3,0 4,1 4,6"),
        ['V'] = new(4, "0,6 2,0 4,6"),
        ['W'] = new(4, "0,6 1,0 2,4 3,0 4,6"),
        ['X'] = new(4, "0,0 4,6|0,6 4,0"),
        ['Y'] = new(4, "0,6 2,3 4,6|2,3 2,0"),
        ['Z'] = new(4, "0,6 4,6 0,0 4,0"),

        // The zero is narrower-shouldered than O and carries a slash so the two never get confused
        // on a part number.
        ['0'] = new(4, "1,0 0,1.5 0,4.5 1,6 3,6 4,4.5 4,1.5 3,0 1,0|3.6,5 0.4,1"),
        ['1'] = new(4, "1,5 2,6 2,0|1,0 3,0"),
        ['2'] = new(4, "0,5 1,6 3,6 4,5 4,4 0,0 4,0"),
        ['3'] = new(4, "0,5 1,6 3,6 4,5 4,4 3,3 1.5,3|3,3 4,2 4,1 3,0 1,0 0,1"),
        ['4'] = new(4, "3,0 3,6 0,2 4,2"),
        ['5'] = new(4, "4,6 0,6 0,3.5 3,3.5 4,2.5 4,1 3,0 1,0 0,1"),
        ['6'] = new(4, "3.5,6 1.5,6 0,4 0,1 1,0 3,0 4,1 4,2.5 3,3.5 1,3.5 0,2.5"),
        ['7'] = new(4, "0,6 4,6 1.5,0"),
        ['8'] = new(4, "1,3 0,4 0,5 1,6 3,6 4,5 4,4 3,3 1,3 0,2 0,1 1,0 3,0 4,1 4,2 3,3"),
        ['9'] = new(4, "0.5,0 2.5,0 4,2 4,5 3,6 1,6 0,5 0,3.5 1,2.5 3,2.5 4,3.5"),

        [' '] = new(3, ""),
        ['.'] = new(0.6, DotAtBase),
        [','] = new(0.6, "0,0.6 0.6,0.6 0.6,0 0,-1.5"),
        [':'] = new(0.6, DotAtBase + "|0,3.4 0.6,3.4 0.6,4 0,4 0,3.4"),
        [';'] = new(0.6, "0,0.6 0.6,0.6 0.6,0 0,-1.5|0,3.4 0.6,3.4 0.6,4 0,4 0,3.4"),
        ['-'] = new(3, "0,3 3,3"),
        ['+'] = new(4, "0.5,3 3.5,3|2,1.5 2,4.5"),
        ['/'] = new(4, "0,0 4,6"),
        ['('] = new(1.5, "1.5,6.5 0.3,4.5 0.3,1.5 1.5,-0.5"),
        [')'] = new(1.5, "0,6.5 1.2,4.5 1.2,1.5 0,-0.5"),
        ['#'] = new(4, "1,0 1.5,6|2.5,0 3,6|0,2 4,2|0,4 4,4"),
        ['='] = new(4, "0.5,2 3.5,2|0.5,4 3.5,4"),
        ['%'] = new(4, "0,0 4,6|0,6 1.2,6 1.2,4.8 0,4.8 0,6|2.8,0 4,0 4,1.2 2.8,1.2 2.8,0"),
        ['\''] = new(0.6, "0.3,6 0.3,4.5"),
        ['"'] = new(1.6, "0.3,6 0.3,4.5|1.3,6 1.3,4.5"),
        ['!'] = new(0.6, "0.3,6 0.3,1.8|" + DotAtBase),
        ['?'] = new(4, "0,5 1,6 3,6 4,5 4,4 2,2.8 2,1.8|1.7,0 2.3,0 2.3,0.6 1.7,0.6 1.7,0"),
        ['<'] = new(4, "4,5.5 0,3 4,0.5"),
        ['>'] = new(4, "0,5.5 4,3 0,0.5"),
        ['_'] = new(4, "0,-1 4,-1"),
        ['*'] = new(4, "2,1.5 2,4.5|0.7,2.25 3.3,3.75|0.7,3.75 3.3,2.25"),
        ['&'] = new(4, "4,0 0.6,4.4 0.6,5.3 1.4,6 2.3,6 3,5.3 3,4.5 0,2 0,0.9 0.9,0 2.4,0 4,2"),
        ['['] = new(1.5, "1.5,6.5 0.3,6.5 0.3,-0.5 1.5,-0.5"),
        [']'] = new(1.5, "0,6.5 1.2,6.5 1.2,-0.5 0,-0.5"),
        ['|'] = new(0.6, "0.3,6.5 0.3,-1"),
        ['\u00B0'] = new(1.6, "0.3,6 1.3,6.3 1.6,5.3 0.6,5 0.3,6"),   // degree sign: a small tilted square
        ['\u00D7'] = new(4, "0.8,1.8 3.2,4.2|0.8,4.2 3.2,1.8"),       // multiplication sign
    };

    /// <summary>Characters drawn with another character's glyph: accented Latin letters with their
    /// base letter, typographic quotes and dashes with the plain ones, and the no-break space as a space.
    /// (String normalisation is unavailable under invariant globalisation, so the fold is explicit.)</summary>
    internal static readonly IReadOnlyDictionary<char, char> Folds = BuildFolds(
        ("\u00C0\u00C1\u00C2\u00C3\u00C4\u00C5", 'A'), ("\u00C7", 'C'), ("\u00C8\u00C9\u00CA\u00CB", 'E'),
        ("\u00CC\u00CD\u00CE\u00CF", 'I'), ("\u00D1", 'N'), ("\u00D2\u00D3\u00D4\u00D5\u00D6\u00D8", 'O'),
        ("\u00D9\u00DA\u00DB\u00DC", 'U'), ("\u00DD\u0178", 'Y'),
        ("\u2018\u2019\u201A\u2032", '\''), ("\u201C\u201D\u201E\u2033", '"'),
        ("\u2010\u2011\u2012\u2013\u2014\u2212", '-'), ("\u00A0\u2007\u202F", ' '), ("\u00B7\u2022", '*'));

    private static Dictionary<char, char> BuildFolds(params (string From, char To)[] groups)
    {
        var folds = new Dictionary<char, char>();
        foreach (var (from, to) in groups)
            foreach (char c in from) folds[c] = to;
        return folds;
    }

    /// <summary>Drawn for any character the font does not know: a box with both diagonals (unlike the
    /// slashed zero), so the gap is obvious on the sheet instead of silently missing.</summary>
    internal static readonly GlyphSource Unknown = new(4, "0,0 4,0 4,6 0,6 0,0 4,6|0,6 4,0");
}
