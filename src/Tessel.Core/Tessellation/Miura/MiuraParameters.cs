namespace Tessel.Core.Tessellation.Miura;

/// <summary>Parameters of a Miura-type tessellation draped on a target.</summary>
/// <param name="CellsX">Cells along the zig-zag direction (each cell is 2 facets wide), or null to
/// derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellsY">Cells across the zig-zag, or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Plan size of one cell in metres (2S by 2L in Schenk &amp; Guest's notation),
/// used where a cell count is null.</param>
/// <param name="SectorAngleDeg">Acute facet angle gamma in degrees, in (0, 90).</param>
/// <param name="FoldDepth">Offset between the two vertex layers in metres (the cell height H), &gt; 0.</param>
/// <param name="OrientationDeg">Angle of the zig-zag direction (cell x axis) on the footprint,
/// counter-clockwise from the footprint's x axis, degrees.</param>
public sealed record MiuraParameters(
    int? CellsX = null,
    int? CellsY = null,
    double? CellSize = null,
    double SectorAngleDeg = 60,
    double FoldDepth = 0.05,
    double OrientationDeg = 0);
