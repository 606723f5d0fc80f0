using Tessel.Core.Model;
using Tessel.Core.Sheets;

namespace Tessel.Output.Sheets;

/// <summary>Argument checks shared by the sheet writers.</summary>
internal static class SheetWriterGuard
{
    /// <summary>Returns the single sheet of a one-file-per-sheet writer, or throws.</summary>
    public static Sheet Single(IReadOnlyList<Sheet> sheets, string format)
    {
        ArgumentNullException.ThrowIfNull(sheets);
        if (sheets.Count != 1)
            throw new ArgumentException($"A {format} file holds exactly one sheet; got {sheets.Count}. Write one file per sheet.", nameof(sheets));
        return Check(sheets[0]);
    }

    /// <summary>Checks that a sheet has a drawable size and finite points.</summary>
    public static Sheet Check(Sheet sheet)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        if (!(sheet.WidthMm > 0) || !(sheet.HeightMm > 0) || !double.IsFinite(sheet.WidthMm) || !double.IsFinite(sheet.HeightMm))
            throw new ArgumentException($"Sheet {sheet.Number} has no drawable size ({sheet.WidthMm} x {sheet.HeightMm} mm).");
        foreach (SheetLine line in sheet.Lines)
            foreach (var p in line.Points)
                if (!double.IsFinite(p.X) || !double.IsFinite(p.Y))
                    throw new ArgumentException($"Sheet {sheet.Number} has a {line.Class} line with a non-finite point.");
        return sheet;
    }

    /// <summary>Lines of one class in their original (cutting) order, skipping lines with fewer than two points.</summary>
    public static IEnumerable<SheetLine> LinesOf(Sheet sheet, LineClass lineClass) =>
        sheet.Lines.Where(l => l.Class == lineClass && l.Points.Length >= 2);
}
