using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Sheets;

/// <summary>Why a label is on the sheet.</summary>
public enum LabelPurpose
{
    /// <summary>Seam code, printed on both parts beside the seam edge.</summary>
    SeamCode,
    /// <summary>Part number, printed on the part's largest facet beside its orientation arrow.</summary>
    PartNumber,
}

/// <summary>Text to be written on a sheet with single-stroke glyphs.</summary>
/// <param name="Sheet">Sheet number (1-based).</param>
/// <param name="Text">Upper-case letters and digits only.</param>
/// <param name="Centre">Centre of the text block, mm (y down).</param>
/// <param name="HeightMm">Cap height.</param>
/// <param name="AngleRadians">Direction of the baseline from +x toward +y (clockwise as seen, since y is down);
/// kept within (-pi/2, pi/2] so text never reads upside down.</param>
public sealed record SheetLabel(int Sheet, string Text, Vec2 Centre, double HeightMm, double AngleRadians, LabelPurpose Purpose)
{
    /// <summary>Job the label is written in: "front", or "back" (then Centre and AngleRadians are in the
    /// mirrored back job's coordinates, x' = W - x).</summary>
    public string Side { get; init; } = "front";
}

/// <summary>One seam: a mesh edge along which the pattern was cut apart; a tab on one side, the same code on both.</summary>
/// <param name="Code">Unique code printed on both edges.</param>
/// <param name="Edge">Edge index in the flat pattern.</param>
/// <param name="TabPart">Part number (1-based) carrying the glue tab.</param>
/// <param name="MatingPart">Part number whose edge is glued onto the tab.</param>
/// <param name="Role">Crease role of the seam edge in the pattern.</param>
/// <param name="LengthMm">Edge length at model scale.</param>
/// <param name="Tab">Tab outline on its sheet, mm (open ring).</param>
public sealed record Seam(string Code, int Edge, int TabPart, int MatingPart, CreaseRole Role, double LengthMm, Vec2[] Tab);

/// <summary>A part placed on a sheet. Sheet position = rotate(model position, AngleRadians) + Offset, where
/// model positions are the flat pattern scaled to mm with y flipped to point down.</summary>
/// <param name="Number">Part number, 1-based.</param>
/// <param name="Sheet">Sheet number, 1-based.</param>
/// <param name="Faces">Face indices of the flat pattern in this part, ascending.</param>
/// <param name="Vertices">Vertex indices used by the part, ascending.</param>
/// <param name="VertexPositions">Sheet positions of <paramref name="Vertices"/>, mm.</param>
/// <param name="Outline">Cut outline including tabs and kerf allowance, mm (open ring).</param>
/// <param name="AreaMm2">Area inside the outline.</param>
public sealed record PlacedPart(int Number, int Sheet, int[] Faces, int[] Vertices, Vec2[] VertexPositions,
    double AngleRadians, Vec2 Offset, Vec2[] Outline, double AreaMm2);

/// <summary>Everything the sheet stage makes: the sheets in job order plus what the writers and the report need.</summary>
/// <param name="Sheets">Front jobs in sheet order; with two-sided work each sheet's mirrored back job
/// (Side "back", same Number) comes right before its front job, because through-cuts go last.</param>
public sealed record SheetLayoutResult(Sheet[] Sheets, PlacedPart[] Parts, Seam[] Seams, SheetLabel[] Labels, SheetFigures Figures);
