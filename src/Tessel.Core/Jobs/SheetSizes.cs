namespace Tessel.Core.Jobs;

/// <summary>Named paper sizes in millimetres, portrait (width &lt;= height).</summary>
/// <remarks>ISO 216 A and B series; US Letter and Tabloid from ANSI/ASME Y14.1
/// (values as listed in shared/reference/fabrication.md).</remarks>
public static class SheetSizes
{
    /// <summary>Every named size, in catalogue order.</summary>
    public static readonly IReadOnlyList<(string Name, double WidthMm, double HeightMm)> All =
    [
        ("A0", 841, 1189), ("A1", 594, 841), ("A2", 420, 594), ("A3", 297, 420), ("A4", 210, 297), ("A5", 148, 210),
        ("B0", 1000, 1414), ("B1", 707, 1000), ("B2", 500, 707), ("B3", 353, 500), ("B4", 250, 353), ("B5", 176, 250),
        ("Letter", 215.9, 279.4), ("Tabloid", 279.4, 431.8),
    ];

    /// <summary>Looks a size up by name, ignoring case.</summary>
    public static bool TryFind(string name, out double widthMm, out double heightMm)
    {
        foreach (var s in All)
        {
            if (string.Equals(s.Name, name, StringComparison.OrdinalIgnoreCase))
            {
                widthMm = s.WidthMm; heightMm = s.HeightMm;
                return true;
            }
        }
        widthMm = heightMm = double.NaN;
        return false;
    }
}
