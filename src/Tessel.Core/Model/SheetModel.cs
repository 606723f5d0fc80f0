using Tessel.Core.Geometry;

namespace Tessel.Core.Model;

/// <summary>What a line on a fabrication sheet is for; each class becomes one layer in every writer.</summary>
public enum LineClass
{
    /// <summary>Through-cut inside a part (holes, slits).</summary>
    CutInner,
    /// <summary>Through-cut along a part's (and its tabs') outline; cut last.</summary>
    CutOutline,
    /// <summary>Mountain fold (scored or perforated as the settings say).</summary>
    Mountain,
    /// <summary>Valley fold.</summary>
    Valley,
    /// <summary>Fold line at the root of a glue tab.</summary>
    TabFold,
    /// <summary>Single-stroke text engraved or drawn on the part (seam codes, part numbers).</summary>
    Label,
    /// <summary>Drawn only, never cut: legend, scale bar, cautions, sheet frame.</summary>
    Annotation,
    /// <summary>A crease the fitted model leaves flat (within <see cref="Checks.FoldRoles.FlatToleranceDeg"/>):
    /// drawn so the maker sees the facet edge, never folded, scored or cut.</summary>
    FlatCrease,
}

/// <summary>An open or closed polyline on a sheet, in millimetres, origin at the sheet's top-left
/// corner, x to the right, y down (the SVG/PDF/PNG convention; the DXF writer flips y).</summary>
public sealed record SheetLine(LineClass Class, Vec2[] Points, bool Closed = false);

/// <summary>One physical sheet: its size and everything drawn on it, in cutting order.</summary>
public sealed record Sheet(int Number, double WidthMm, double HeightMm, SheetLine[] Lines)
{
    /// <summary>Which job this sheet is: the front job, or the mirrored back job of two-sided work.</summary>
    public string Side { get; init; } = "front";
    /// <summary>Share of the usable area covered by parts (0..1).</summary>
    public double Utilisation { get; init; }
}
