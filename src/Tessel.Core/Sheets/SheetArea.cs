namespace Tessel.Core.Sheets;

/// <summary>The room a layout has on each sheet, millimetres: the usable area inside the margins and above
/// the annotation strip, and how far glue tabs and the kerf may reach past a part's faces.</summary>
/// <param name="SheetWidth">Sheet width.</param>
/// <param name="SheetHeight">Sheet height.</param>
/// <param name="Margin">Margin on every side.</param>
/// <param name="UsableWidth">Width inside the margins.</param>
/// <param name="UsableHeight">Height inside the margins, less the annotation strip and the spacing above it.</param>
/// <param name="TabRootOffset">How far a tab's root stands off its edge (the material's thickness when
/// that is over 0.5 mm, else 0), so a thick sheet folds round it.</param>
/// <param name="Allowance">Twice the farthest a tab and the kerf reach past a part's faces.</param>
internal sealed record SheetArea(double SheetWidth, double SheetHeight, double Margin, double UsableWidth, double UsableHeight,
    double TabRootOffset, double Allowance)
{
    /// <summary>The area for <paramref name="settings"/>, which it checks first.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A scale, tab, kerf, gap or margin setting out of range.</exception>
    /// <exception cref="ArgumentException">When the margins and tab allowance leave no room on the sheet.</exception>
    public static SheetArea For(FabricationSettings settings)
    {
        if (!(settings.ScaleDenominator > 0)) throw new ArgumentOutOfRangeException(nameof(settings), "scale denominator must be positive");
        if (!(settings.TabWidthMm > 0)) throw new ArgumentOutOfRangeException(nameof(settings), "tab width must be positive");
        if (!(settings.TabTaperDegrees > 0 && settings.TabTaperDegrees < 90)) throw new ArgumentOutOfRangeException(nameof(settings), "tab taper must lie between 0 and 90 degrees");
        if (!(settings.KerfMm >= 0 && settings.PartGapMm >= 0 && settings.MarginMm >= 0)) throw new ArgumentOutOfRangeException(nameof(settings), "kerf, gap and margin must not be negative");
        var material = settings.Material;
        double sheetW = settings.Sheet.WidthMm, sheetH = settings.Sheet.HeightMm, margin = settings.MarginMm;
        double usableW = sheetW - 2 * margin;
        // Parts stay above the annotation strip, with the part spacing between them and it.
        double usableH = sheetH - 2 * margin - (settings.AnnotationStripMm > 0 ? settings.AnnotationStripMm + settings.SpacingMm : 0);
        double rootOffset = material.ThicknessMm > 0.5 ? material.ThicknessMm : 0;
        // Tabs reach at most width + root offset past a part's faces, and the kerf allowance half a kerf
        // more, so a part whose faces fit the usable area less twice that fits with its tabs in any turning.
        double allowance = 2 * (settings.TabWidthMm + rootOffset + settings.KerfMm / 2);
        if (usableW - allowance <= 0 || usableH - allowance <= 0)
            throw new ArgumentException($"sheet {settings.Sheet.Name} leaves no room inside margins of {margin} mm and tabs of {settings.TabWidthMm} mm");
        return new SheetArea(sheetW, sheetH, margin, usableW, usableH, rootOffset, allowance);
    }
}
