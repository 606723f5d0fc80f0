namespace Tessel.Core.Sheets;

/// <summary>A sheet or laser-bed size in millimetres, width along x (to the right), height along y (down).</summary>
public sealed record SheetSize(string Name, double WidthMm, double HeightMm)
{
    /// <summary>True when the sheet is at least as tall as it is wide.</summary>
    public bool IsPortrait => HeightMm >= WidthMm;

    /// <summary>The same sheet turned so that its short side runs along x.</summary>
    public SheetSize Portrait => IsPortrait ? this : new(Name, HeightMm, WidthMm);

    /// <summary>The same sheet turned so that its long side runs along x.</summary>
    public SheetSize Landscape => WidthMm >= HeightMm ? this : new(Name, HeightMm, WidthMm);
}
