namespace Tessel.Core.Jobs;

/// <summary>The job's <c>tessellation</c> section: which crease family and how fine.</summary>
/// <param name="Family">One of <see cref="Catalog.Families"/>.</param>
/// <param name="CellsX">Cells across x; null means derive from <paramref name="CellSize"/>.</param>
/// <param name="CellsY">Cells across y; null means derive from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Approximate cell size in the target's units, used when a cell count is missing.</param>
/// <param name="SectorAngleDeg">Acute sector angle of the starting cell, degrees.</param>
/// <param name="FoldDepth">Distance between the top and bottom vertex layers in the target's units; null = chosen from the cell size.</param>
/// <param name="OrientationDeg">Rotation of the pattern in plan, degrees counter-clockwise from x.</param>
/// <param name="FlatDiagonalShare">Free-triangulated family: share (0..1) of quad diagonals left flat.</param>
public sealed record TessellationSpec(
    string Family,
    int? CellsX,
    int? CellsY,
    double? CellSize,
    double SectorAngleDeg,
    double? FoldDepth,
    double OrientationDeg,
    double FlatDiagonalShare);
