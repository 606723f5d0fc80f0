using System.Globalization;

namespace Tessel.Core.Sheets;

/// <summary>Named sheet sizes (portrait, width x height in mm) and a parser for user input.</summary>
public static class SheetSizes
{
    // ISO 216 A and B series, mm (docs/reference/fabrication.md, [S] ISO 216).
    public static readonly SheetSize A0 = new("A0", 841, 1189);
    public static readonly SheetSize A1 = new("A1", 594, 841);
    public static readonly SheetSize A2 = new("A2", 420, 594);
    public static readonly SheetSize A3 = new("A3", 297, 420);
    public static readonly SheetSize A4 = new("A4", 210, 297);
    public static readonly SheetSize A5 = new("A5", 148, 210);
    public static readonly SheetSize B0 = new("B0", 1000, 1414);
    public static readonly SheetSize B1 = new("B1", 707, 1000);
    public static readonly SheetSize B2 = new("B2", 500, 707);
    public static readonly SheetSize B3 = new("B3", 353, 500);
    public static readonly SheetSize B4 = new("B4", 250, 353);
    public static readonly SheetSize B5 = new("B5", 176, 250);

    // US sizes: 8.5 x 11 in and 11 x 17 in, exact via 25.4 mm/in ([S] ANSI/ASME Y14.1).
    public static readonly SheetSize Letter = new("Letter", 215.9, 279.4);
    public static readonly SheetSize Tabloid = new("Tabloid", 279.4, 431.8);

    // Laser beds: our own names; sizes are typical ranges from docs/reference/fabrication.md [M], landscape as the bed sits.
    public static readonly SheetSize DeskBed = new("desk-bed", 500, 300);
    public static readonly SheetSize ShopBed = new("shop-bed", 600, 400);
    public static readonly SheetSize StudioBed = new("studio-bed", 900, 600);
    public static readonly SheetSize HallBed = new("hall-bed", 1200, 900);

    /// <summary>Every named size, in a fixed order.</summary>
    public static readonly SheetSize[] All =
        [A0, A1, A2, A3, A4, A5, B0, B1, B2, B3, B4, B5, Letter, Tabloid, DeskBed, ShopBed, StudioBed, HallBed];

    /// <summary>Finds a named size, ignoring case ("a4", "Tabloid", "studio-bed").</summary>
    public static bool TryFind(string name, out SheetSize size)
    {
        foreach (var s in All)
            if (string.Equals(s.Name, name.Trim(), StringComparison.OrdinalIgnoreCase)) { size = s; return true; }
        size = A4;
        return false;
    }

    /// <summary>Reads "A4", "a3 landscape", "letter portrait" or a custom "420x297" (mm, width x height).</summary>
    /// <exception cref="FormatException">When the text names no size.</exception>
    public static SheetSize Parse(string text)
    {
        var words = text.Trim().Split((char[])[' ', '\t'], StringSplitOptions.RemoveEmptyEntries);
        if (words.Length == 0) throw new FormatException("empty sheet size");
        string? turn = words.Length > 1 ? words[1].ToLowerInvariant() : null;
        if (words.Length > 2 || (turn is not null and not "portrait" and not "landscape"))
            throw new FormatException($"sheet size '{text}': expected a name or WxH, then optionally portrait or landscape");

        SheetSize size;
        var parts = words[0].Split('x', 'X');
        if (parts.Length == 2
            && double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out double w)
            && double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double h))
        {
            if (!(w > 0 && h > 0)) throw new FormatException($"sheet size '{text}': width and height must be positive");
            size = new SheetSize($"{w.ToString("R", CultureInfo.InvariantCulture)}x{h.ToString("R", CultureInfo.InvariantCulture)}", w, h);
        }
        else if (!TryFind(words[0], out size))
            throw new FormatException($"unknown sheet size '{words[0]}'; known: {string.Join(", ", All.Select(s => s.Name))}");

        return turn switch
        {
            "portrait" => size.Portrait,
            "landscape" => size.Landscape,
            _ => size,
        };
    }
}
