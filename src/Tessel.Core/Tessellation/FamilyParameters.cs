namespace Tessel.Core.Tessellation;

/// <summary>The parameters every family generator draws from; each family reads the ones it uses.</summary>
/// <param name="CellsX">Cells along x (Miura-type: zig-zag cells; Yoshimura: rings along the vault axis;
/// free net: grid cells; waterbomb: bases per row), or null to derive from <paramref name="CellSize"/>.</param>
/// <param name="CellsY">Cells along y (Yoshimura: triangle bases across the arc; waterbomb: rows), or null.</param>
/// <param name="CellSize">Plan size of one cell in metres, used where a count is null.</param>
/// <param name="SectorAngleDeg">Miura-type: acute facet angle, degrees in (0, 90).</param>
/// <param name="FoldDepth">Miura-type and waterbomb: distance between the two vertex layers, metres.</param>
/// <param name="OrientationDeg">Miura-type: direction of the zig-zag on the footprint, degrees.</param>
/// <param name="FlatDiagonalShare">Free net: share of grid cells kept as planar quad panels, [0, 1].</param>
public sealed record FamilyParameters(
    int? CellsX = null,
    int? CellsY = null,
    double? CellSize = null,
    double SectorAngleDeg = 60,
    double FoldDepth = 0.05,
    double OrientationDeg = 0,
    double FlatDiagonalShare = 0)
{
    /// <summary>Ask the generator for a start that is exactly buildable on a plane where the family has
    /// one that differs from its usual drape (the fit's continuation starts from it).</summary>
    public bool BuildableStart { get; init; }
}
