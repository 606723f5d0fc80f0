using System.Globalization;
using Tessel.Core.Model;

namespace Tessel.Core.Sheets;

/// <summary>How one <see cref="LineClass"/> is drawn and what the cutter does with it.</summary>
/// <param name="DisplayName">Human name used in legends, e.g. "Valley fold".</param>
/// <param name="LayerName">Layer name in SVG and DXF: upper-case letters, digits, '-' and '_' only,
/// starting with a letter (so it is a valid DXF R12 layer name and XML id).</param>
/// <param name="ColourHex">Display colour as "#RRGGBB".</param>
/// <param name="DxfColourIndex">AutoCAD Colour Index (1..255) for the DXF layer.</param>
/// <param name="DashPattern">Display dash pattern in multiples of the table's dash unit d:
/// alternating dash, gap, dash, gap... (a dot is a dash of 0.5 d); empty for a continuous line.</param>
/// <param name="Operation">What the cutter does with lines of this class.</param>
public sealed record LineStyle(
    string DisplayName,
    string LayerName,
    string ColourHex,
    int DxfColourIndex,
    IReadOnlyList<double> DashPattern,
    LineOperation Operation)
{
    /// <summary>Checks the invariants the writers rely on; throws <see cref="ArgumentException"/> otherwise.</summary>
    public void Validate()
    {
        if (string.IsNullOrWhiteSpace(DisplayName)) throw new ArgumentException("A line style needs a display name.");
        if (LayerName.Length == 0 || !char.IsAsciiLetterUpper(LayerName[0])
            || !LayerName.All(c => char.IsAsciiLetterUpper(c) || char.IsAsciiDigit(c) || c is '-' or '_'))
            throw new ArgumentException($"Layer name '{LayerName}' must start with A-Z and use only A-Z, 0-9, '-' and '_'.");
        _ = Rgb;
        if (DxfColourIndex is < 1 or > 255) throw new ArgumentException($"DXF colour index {DxfColourIndex} is outside 1..255.");
        if (DashPattern.Count % 2 != 0) throw new ArgumentException("A dash pattern alternates dash and gap, so it needs an even count.");
        if (DashPattern.Any(v => !(v > 0) || double.IsInfinity(v))) throw new ArgumentException("Dash and gap lengths must be positive.");
    }

    /// <summary>The colour as red, green, blue bytes.</summary>
    public (byte R, byte G, byte B) Rgb
    {
        get
        {
            if (ColourHex.Length != 7 || ColourHex[0] != '#'
                || !int.TryParse(ColourHex.AsSpan(1), NumberStyles.AllowHexSpecifier, CultureInfo.InvariantCulture, out int rgb))
                throw new ArgumentException($"Colour '{ColourHex}' is not in #RRGGBB form.");
            return ((byte)(rgb >> 16), (byte)(rgb >> 8), (byte)rgb);
        }
    }

    /// <summary>Grey level 0 (black) .. 255 (white) this colour prints as on a monochrome device,
    /// by the Rec. 601 luma weights 0.299 R + 0.587 G + 0.114 B that greyscale conversion commonly uses.</summary>
    public double GreyLevel
    {
        get { var (r, g, b) = Rgb; return 0.299 * r + 0.587 * g + 0.114 * b; }
    }

    /// <summary>True when the line is drawn continuous (no dashes).</summary>
    public bool IsContinuous => DashPattern.Count == 0;
}
