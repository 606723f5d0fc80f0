namespace Tessel.Core.Tessellation.FreeTriangulated;

/// <summary>Parameters of a free triangulated developable net.</summary>
/// <param name="CellsX">Grid cells along x over the footprint's bounding box, or null to derive it from
/// <paramref name="CellSize"/>.</param>
/// <param name="CellsY">Grid cells along y, or null to derive it from <paramref name="CellSize"/>.</param>
/// <param name="CellSize">Plan size of one grid cell in metres, used where a count is null.</param>
/// <param name="FlatDiagonalShare">Share of the grid cells, in [0, 1], kept as planar quad panels (their
/// diagonal a flat crease, held planar by the fit) instead of two triangles folded along the diagonal.
/// Measured in this build: 6 x 6 nets with shares 0.15 and 0.3 on a cap and a saddle did not reach the
/// constraints within 300 steps (developability 0.002-0.024 rad, planarity 5e-5-0.015 left), while the
/// all-triangle net converges; treat shares above 0 as experimental and check the fit's residuals.</param>
/// <param name="Crumple">Standard deviation of the start's deterministic out-of-surface offsets of interior
/// vertices, as a fraction of the cell size (see <see cref="FreeTriangulatedGenerator"/>); 0 starts on
/// the target itself.</param>
public sealed record FreeTriangulatedParameters(
    int? CellsX = null,
    int? CellsY = null,
    double? CellSize = null,
    double FlatDiagonalShare = 0,
    double Crumple = 0.1);
